import pg from "pg";

/** Runs `run` and counts the statements it sends to PostgreSQL, on the driver (every pool, every client). */
export async function countStatements<T>(run: () => Promise<T>): Promise<{ value: T; statements: number }> {
  const original = pg.Client.prototype.query;
  let statements = 0;
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    statements += 1;
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    return { value: await run(), statements };
  } finally {
    pg.Client.prototype.query = original;
  }
}
