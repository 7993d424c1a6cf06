import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { config } from "@/lib/config";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: lib functions accept both. */
export type Executor = Database | Transaction;

// One pool per process; kept on globalThis so Next's dev reloads do not open new pools.
const globalForDb = globalThis as unknown as { placewrightPool?: Pool; placewrightDb?: Database };

function poolOptions() {
  // `next build` loads route modules to read their settings; it opens no connection and so needs
  // no database settings (images are built without them).
  if (process.env.NEXT_PHASE === "phase-production-build") return { max: 1 };
  const { url, poolMax, statementTimeoutMs } = config().database;
  return {
    connectionString: url,
    max: poolMax,
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

export async function closeDb(): Promise<void> {
  const pool = globalForDb.placewrightPool;
  globalForDb.placewrightPool = undefined;
  globalForDb.placewrightDb = undefined;
  await pool?.end();
}

export { schema };
