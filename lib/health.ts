// Liveness and readiness for a load balancer or an orchestrator. Live: the process answers (no
// database involved, so a database outage does not get every instance restarted). Ready: this
// instance should take traffic: not shutting down, the database answers, and every migration this
// build was made with has been applied (a roll-out runs migrations once, before the new instances).
import { sql } from "drizzle-orm";
import { db } from "@/db";
import journal from "@/drizzle/meta/_journal.json";
import { isDraining } from "@/lib/lifecycle";
import { logger } from "@/lib/log";

export type Readiness = {
  ready: boolean;
  checks: { shutdown: "running" | "draining"; database: "ready" | "unavailable"; migrations: "applied" | "pending" | "unknown" };
  pendingMigrations?: string[];
};

/** Migrations of this build not yet recorded by drizzle's migrator (it stores each one's `when` as created_at). */
async function pendingMigrations(): Promise<string[]> {
  const result = await db.execute(sql`select coalesce(max(created_at), 0)::text as last from drizzle.__drizzle_migrations`);
  const last = Number((result.rows[0] as { last: string }).last);
  return journal.entries.filter((e) => e.when > last).map((e) => e.tag);
}

export async function readiness(): Promise<Readiness> {
  const checks: Readiness["checks"] = { shutdown: isDraining() ? "draining" : "running", database: "unavailable", migrations: "unknown" };
  let pending: string[] = [];
  try {
    await db.execute(sql`select 1`);
    checks.database = "ready";
    try {
      pending = await pendingMigrations();
      checks.migrations = pending.length ? "pending" : "applied";
    } catch (err) {
      // No migrations table at all: nothing has been applied yet.
      logger.warn({ err }, "readiness: migrations table not readable");
      pending = journal.entries.map((e) => e.tag);
      checks.migrations = "pending";
    }
  } catch (err) {
    logger.warn({ err }, "readiness: database unavailable");
  }
  const ready = checks.shutdown === "running" && checks.database === "ready" && checks.migrations === "applied";
  return { ready, checks, ...(pending.length ? { pendingMigrations: pending } : {}) };
}
