import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { config } from "@/lib/config";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: lib functions accept both. */
export type Executor = Database | Transaction;

// One pool per process; kept on globalThis so Next's dev reloads do not open new pools.
const globalForDb = globalThis as unknown as { placewrightPool?: Pool; placewrightDb?: Database; placewrightReadPool?: Pool; placewrightReadDb?: Database };

function poolOptions(kind: "main" | "read" = "main") {
  // `next build` loads route modules to read their settings; it opens no connection and so needs
  // no database settings (images are built without them).
  if (process.env.NEXT_PHASE === "phase-production-build") return { max: 1 };
  const { url, poolMax, readPoolMax, statementTimeoutMs } = config().database;
  return {
    connectionString: url,
    max: kind === "read" ? readPoolMax : poolMax,
    application_name: "placewright",
    ...(statementTimeoutMs > 0 ? { statement_timeout: statementTimeoutMs } : {}),
  };
}

export function getPool(): Pool {
  if (!globalForDb.placewrightPool) {
    globalForDb.placewrightPool = new Pool(poolOptions());
  }
  return globalForDb.placewrightPool;
}

export const db: Database = (globalForDb.placewrightDb ??= drizzle(getPool(), { schema }));

/**
 * A second, small pool for short statements that wait on no writer's lock: the session check every
 * request makes, and the sync pull (one read-only snapshot). A burst of pushes queued on a project's
 * change counter holds every connection of the main pool; reads must not queue behind them for one.
 */
export function getReadPool(): Pool {
  if (!globalForDb.placewrightReadPool) {
    globalForDb.placewrightReadPool = new Pool(poolOptions("read"));
  }
  return globalForDb.placewrightReadPool;
}

export const readDb: Database = (globalForDb.placewrightReadDb ??= drizzle(getReadPool(), { schema }));

export async function closeDb(): Promise<void> {
  const pools = [globalForDb.placewrightPool, globalForDb.placewrightReadPool];
  globalForDb.placewrightPool = undefined;
  globalForDb.placewrightDb = undefined;
  globalForDb.placewrightReadPool = undefined;
  globalForDb.placewrightReadDb = undefined;
  await Promise.all(pools.map((pool) => pool?.end()));
}

export { schema };
