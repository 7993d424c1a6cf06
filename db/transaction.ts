// The one transaction helper of the server. A refusal by the database that the app can explain
// (a signed-record trigger, a unique index, a serialization failure or deadlock) leaves it as a
// DbRefusal, so every write (records, sign-offs, the digest, administration) meets the same
// mapping to the app's error vocabulary (lib/records/db-errors.ts, applied by lib/api/handler.ts).
import { DrizzleQueryError } from "drizzle-orm";
import { db, type Executor, type Transaction } from "./index";

/** SQLSTATE raised by the signed-records triggers (drizzle/0002, 0007, 0008). */
export const FROZEN_SQLSTATE = "PW409";

export type DbRefusalKind = "frozen" | "duplicate" | "busy";

export class DbRefusal extends Error {
  constructor(
    readonly kind: DbRefusalKind,
    /** The PostgreSQL SQLSTATE, kept so callers that test `code` still can. */
    readonly code: string,
    /** The unique index that refused, for `duplicate`. */
    readonly constraint: string | undefined,
    options: { cause: unknown },
  ) {
    super(`database refused the write (${kind}, ${code})`, options);
    this.name = "DbRefusal";
  }
}

type PgError = { code?: string; constraint?: string };

function pgError(error: unknown): PgError | null {
  const inner = error instanceof DrizzleQueryError ? error.cause : error;
  if (inner && typeof inner === "object" && "code" in inner) return inner as PgError;
  return null;
}

const KIND_BY_CODE: Record<string, DbRefusalKind> = { [FROZEN_SQLSTATE]: "frozen", "23505": "duplicate", "40001": "busy", "40P01": "busy" };

/** The refusal an error stands for, or null for anything else (left as it is). */
export function dbRefusal(error: unknown): DbRefusal | null {
  if (error instanceof DbRefusal) return error;
  const pg = pgError(error);
  const kind = pg?.code ? KIND_BY_CODE[pg.code] : undefined;
  return kind ? new DbRefusal(kind, pg!.code!, pg!.constraint, { cause: error }) : null;
}

/** Runs `fn` in a transaction, or in a savepoint of `within`; explainable refusals become DbRefusal. */
export async function transaction<T>(fn: (tx: Transaction) => Promise<T>, within?: Executor): Promise<T> {
  try {
    return await (within ?? db).transaction(fn);
  } catch (error) {
    throw dbRefusal(error) ?? error;
  }
}
