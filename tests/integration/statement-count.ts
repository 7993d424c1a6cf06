import pg from "pg";

/**
 * Runs `run` and counts the statements it sends to PostgreSQL, on the driver: every pool (the main
 * one and the read pool of db/index.ts) and every client, with their texts in order.
 */
export async function countStatements<T>(run: () => Promise<T>): Promise<{ value: T; statements: number; texts: string[] }> {
  const original = pg.Client.prototype.query;
  const texts: string[] = [];
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    const first = args[0] as string | { text?: string };
    texts.push(typeof first === "string" ? first : (first?.text ?? ""));
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    return { value: await run(), statements: texts.length, texts };
  } finally {
    pg.Client.prototype.query = original;
  }
}
