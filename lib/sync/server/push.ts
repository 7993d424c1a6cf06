// POST /api/sync/push (SYNC.md): a device's mutations, applied in order, each in its own
// transaction together with its stored result and the device's watermark, each exactly once.
import { and, eq, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { syncClients, syncMutations } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { AppError, forbidden } from "@/lib/errors";
import { getRole } from "@/lib/users/queries";
import { SYNC_SCHEMA_VERSION, type Mutation, type MutationResult, type PushRequest, type PushResponse } from "../protocol";
import { applyMutation, type Applied } from "./apply";

export class SyncGapError extends AppError {
  constructor(readonly expectedId: number) {
    super("conflict", `Changes are missing before this one: the server expects change ${expectedId} next.`, undefined, {
      reason: "gap",
      expectedId,
    });
  }
}

/** Test seam: runs inside the mutation's transaction after the write, before the watermark moves. */
export type PushHooks = { afterApply?: (tx: Transaction, m: Mutation, applied: Applied) => Promise<void> };

/** Locks (creating on first use) the device row; a device id owned by another user is refused. */
async function lockClient(tx: Transaction, clientId: string, user: SessionUser) {
  await tx.insert(syncClients).values({ id: clientId, userId: user.id }).onConflictDoNothing();
  const [client] = await tx.select().from(syncClients).where(eq(syncClients.id, clientId)).for("update");
  if (client.userId !== user.id) throw forbidden("This device id belongs to another user. Sign out and in again on this device.");
  return client;
}

const storedResult = (row: typeof syncMutations.$inferSelect): MutationResult => ({
  id: row.mutationId,
  result: row.result as MutationResult["result"],
  ...(row.version != null ? { version: row.version } : {}),
  ...(row.conflictId ? { conflictId: row.conflictId } : {}),
  ...(row.reason ? { reason: row.reason } : {}),
  ...(row.message ? { message: row.message } : {}),
});

/** True for failures worth retrying unchanged: lost connections, serialization failures, deadlocks. */
export function isTransient(error: unknown): boolean {
  if (error instanceof AppError) return error.code === "unavailable";
  const e = (error as { cause?: unknown })?.cause ?? error;
  const code = (e as { code?: string })?.code ?? "";
  return (
    ["40001", "40P01", "57P01", "57P02", "57P03", "53300", "ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE"].includes(code) ||
    code.startsWith("08") ||
    /Connection terminated|timeout exceeded when trying to connect/i.test(String((e as Error)?.message ?? ""))
  );
}

/**
 * The payload is kept so a person can see a refused change, except when the sender may not make
 * that kind of change at all (not a member, or a role without the write): otherwise a read-only
 * account could store 16 KB per change without end.
 */
const keptArgs = (applied: Applied, m: Mutation) =>
  applied.result === "rejected" && (applied.reason === "forbidden" || applied === UNKNOWN_PROJECT) ? {} : m.args;

const UNKNOWN_PROJECT: Applied = { result: "rejected", reason: "not_found", message: "Project not found." };

export async function pushMutations(user: SessionUser, request: PushRequest, hooks: PushHooks = {}): Promise<PushResponse> {
  if (request.schemaVersion !== SYNC_SCHEMA_VERSION) {
    throw new AppError("conflict", "This app version is out of date. Reload the app to sync.", undefined, { reason: "schema" });
  }
  const mutations = [...request.mutations].sort((a, b) => a.id - b.id);
  const results: MutationResult[] = [];
  let lastMutationId = 0;

  for (const m of mutations) {
    const outcome = await db.transaction(async (tx) => {
      const client = await lockClient(tx, request.clientId, user);
      lastMutationId = client.lastMutationId;
      if (m.id <= client.lastMutationId) {
        const [stored] = await tx
          .select()
          .from(syncMutations)
          .where(and(eq(syncMutations.clientId, request.clientId), eq(syncMutations.mutationId, m.id)));
        return stored ? storedResult(stored) : ({ id: m.id, result: "applied" } as MutationResult);
      }
      if (m.id > client.lastMutationId + 1) throw new SyncGapError(client.lastMutationId + 1);

      // A project the sender does not belong to (or that does not exist) is refused before any write,
      // like the project routes: the same answer for both, and nothing of the sender's is kept.
      const member = (await getRole(user.id, m.projectId, tx)) !== null;
      const applied: Applied = member ? await applyMutation(tx, user, request.clientId, m) : UNKNOWN_PROJECT;
      await hooks.afterApply?.(tx, m, applied);
      await tx.insert(syncMutations).values({
        clientId: request.clientId,
        mutationId: m.id,
        name: m.name,
        recordType: m.recordType,
        projectId: member ? m.projectId : null,
        recordId: m.recordId,
        args: keptArgs(applied, m),
        baseVersion: m.baseVersion ?? null,
        result: applied.result,
        reason: applied.reason ?? null,
        message: applied.message ?? null,
        version: applied.version ?? null,
        conflictId: applied.conflictId ?? null,
      });
      await tx
        .update(syncClients)
        .set({ lastMutationId: m.id, lastSeenAt: sql`now()` })
        .where(eq(syncClients.id, request.clientId));
      lastMutationId = m.id;
      return { id: m.id, ...applied } satisfies MutationResult;
    });
    results.push(outcome);
  }

  if (mutations.length === 0) {
    lastMutationId = await db.transaction(async (tx) => (await lockClient(tx, request.clientId, user)).lastMutationId);
  }
  return { lastMutationId, results };
}
