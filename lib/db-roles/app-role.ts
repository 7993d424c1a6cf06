// The database role the app connects as (APP_DATABASE_URL): it reads and writes rows and owns
// nothing, so it cannot disable the freeze and append-only triggers, alter or drop a table, or
// bypass row rules (drizzle/0002, 0007, 0008, 0014, 0015). Migrations, the seed, backups and this
// setup run as the owner (DATABASE_URL). Idempotent: run after every migration.
import { sql } from "drizzle-orm";
import type { Executor } from "@/db";

/** The role name and password of a postgres:// URL. */
export function roleOf(url: string): { role: string; password: string | null } {
  const u = new URL(url);
  const role = decodeURIComponent(u.username);
  if (!/^[a-z_][a-z0-9_]{0,62}$/.test(role)) throw new Error("APP_DATABASE_URL must name a role of lower-case letters, digits and _.");
  return { role, password: u.password ? decodeURIComponent(u.password) : null };
}

const ident = (name: string) => sql.raw(`"${name}"`);
const literal = (value: string) => sql.raw(`'${value.replace(/'/g, "''")}'`);

/**
 * Creates (once) and grants the app's role on the owner's connection. The queue schema (pg-boss)
 * must exist first: its job tables are created by the owner, the app only moves rows through them.
 */
export async function ensureAppRole(owner: Executor, appUrl: string, queueSchema = "pgboss"): Promise<string> {
  const { role, password } = roleOf(appUrl);
  const [me] = (await owner.execute(sql`select current_user as name, current_database() as db`)).rows as { name: string; db: string }[];
  if (me.name === role) throw new Error("APP_DATABASE_URL names the owner role: give the app a role of its own.");
  await owner.execute(sql`do $$ begin
    if not exists (select from pg_roles where rolname = ${sql.raw(`'${role}'`)}) then create role ${ident(role)} login; end if;
  end $$`);
  await owner.execute(sql`alter role ${ident(role)} login nosuperuser nocreatedb nocreaterole noreplication nobypassrls ${password ? sql`password ${literal(password)}` : sql.raw("")}`);
  await owner.execute(sql`grant connect on database ${ident(me.db)} to ${ident(role)}`);
  await owner.execute(sql`revoke create on schema public from public`);
  for (const schema of ["public", queueSchema]) {
    await owner.execute(sql`grant usage on schema ${ident(schema)} to ${ident(role)}`);
    await owner.execute(sql`grant select, insert, update, delete on all tables in schema ${ident(schema)} to ${ident(role)}`);
    await owner.execute(sql`grant usage, select on all sequences in schema ${ident(schema)} to ${ident(role)}`);
    await owner.execute(sql`grant execute on all functions in schema ${ident(schema)} to ${ident(role)}`);
    // Tables a later migration (or a new queue) adds are granted too.
    await owner.execute(sql`alter default privileges in schema ${ident(schema)} grant select, insert, update, delete on tables to ${ident(role)}`);
    await owner.execute(sql`alter default privileges in schema ${ident(schema)} grant usage, select on sequences to ${ident(role)}`);
  }
  // The readiness check compares the applied migrations with the build's.
  await owner.execute(sql`grant usage on schema drizzle to ${ident(role)}`);
  await owner.execute(sql`grant select on all tables in schema drizzle to ${ident(role)}`);
  return role;
}
