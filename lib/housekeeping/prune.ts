// Housekeeping: rows that no one can use any more. Each prune is one statement, safe to run at any
// time and from several instances at once.
import { sql } from "drizzle-orm";
import { db, type Executor } from "@/db";

const count = (result: { rowCount: number | null }) => result.rowCount ?? 0;

/** Sign-in links that were used or have expired (they can never sign anyone in again). */
export async function pruneSignInTokens(tx: Executor = db): Promise<number> {
  return count(await tx.execute(sql`delete from sign_in_tokens where used_at is not null or expires_at < now()`));
}

/** Invitations that were accepted or have expired (the link answers "expired or used" either way). */
export async function pruneInvitations(tx: Executor = db): Promise<number> {
  return count(await tx.execute(sql`delete from invitations where accepted_at is not null or expires_at < now()`));
}

/** Rate-limit rows whose window is over (`expire` is epoch milliseconds; null never expires). */
export async function pruneRateLimits(tx: Executor = db): Promise<number> {
  return count(await tx.execute(sql`delete from rate_limits where expire is not null and expire < (extract(epoch from now()) * 1000)::bigint`));
}

/**
 * Stored sync results a device can never ask for again: at or below the device's acknowledged
 * watermark (it has dropped those changes from its outbox, see lib/sync/server/ack.ts). A replay
 * of anything above it still finds its result. Refused changes (`rejected`) are kept: their row
 * is the server's only copy of a payload a person may still need to see.
 */
export async function pruneSyncResults(tx: Executor = db): Promise<number> {
  return count(
    await tx.execute(sql`
      delete from sync_mutations m
      using sync_clients c
      where m.client_id = c.id and m.mutation_id <= c.acked_mutation_id and m.result <> 'rejected'`),
  );
}

export type PruneReport = { signInTokens: number; invitations: number; rateLimits: number; syncResults: number };

export async function runHousekeeping(): Promise<PruneReport> {
  return {
    signInTokens: await pruneSignInTokens(),
    invitations: await pruneInvitations(),
    rateLimits: await pruneRateLimits(),
    syncResults: await pruneSyncResults(),
  };
}
