// pg_dump / pg_restore from Debian's postgresql package (the newest installed major), run as
// child processes. PG_BIN overrides the folder (e.g. a client package of another major).
import { execFile } from "node:child_process";
import { readdirSync } from "node:fs";
import { promisify } from "node:util";

const run = promisify(execFile);

export function pgBin(tool: "pg_dump" | "pg_restore" | "psql"): string {
  if (process.env.PG_BIN) return `${process.env.PG_BIN}/${tool}`;
  const majors = readdirSync("/usr/lib/postgresql", { withFileTypes: true })
    .filter((d) => d.isDirectory() && /^\d+$/.test(d.name))
    .map((d) => Number(d.name))
    .sort((a, b) => a - b);
  if (!majors.length) throw new Error("PostgreSQL client tools not found: install Debian's postgresql (or postgresql-client) package.");
  return `/usr/lib/postgresql/${majors[majors.length - 1]}/bin/${tool}`;
}

/** A consistent dump (one snapshot) in pg_dump's custom format, without owners or grants. */
export async function dumpDatabase(databaseUrl: string, file: string): Promise<void> {
  await run(pgBin("pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${file}`, `--dbname=${databaseUrl}`], { maxBuffer: 64 << 20 });
}

export async function restoreDatabase(databaseUrl: string, file: string): Promise<void> {
  await run(pgBin("pg_restore"), ["--no-owner", "--no-privileges", "--exit-on-error", "--single-transaction", `--dbname=${databaseUrl}`, file], {
    maxBuffer: 64 << 20,
  });
}
