import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

export const DEFAULT_DATABASE_URL = "postgres://placewright@127.0.0.1:54329/placewright";

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: lib functions accept both. */
export type Executor = Database | Transaction;

// One pool per process; kept on globalThis so Next's dev reloads do not open new pools.
const globalForDb = globalThis as unknown as { placewrightPool?: Pool; placewrightDb?: Database };

export function getPool(): Pool {
  if (!globalForDb.placewrightPool) {
    globalForDb.placewrightPool = new Pool({
      connectionString: process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL,
      max: Number(process.env.DATABASE_POOL_MAX ?? 10),
    });
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
