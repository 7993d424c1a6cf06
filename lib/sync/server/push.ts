// POST /api/sync/push (SYNC.md): a device's mutations, applied in order and exactly once, in one
// transaction together with their stored results and the device's watermark.
import { and, eq, inArray, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { insertStatements } from "@/db/json-rows";
import { syncClients, syncMutations } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { AppError, forbidden } from "@/lib/errors";
import { resolveMemberAccess } from "@/lib/auth/access";
import { SYNC_SCHEMA_VERSION, type Mutation, type MutationResult, type PushRequest, type PushResponse } from "../protocol";
import { planCreates, writeCreates, type CreateInput } from "@/lib/records/create-batch";
import { applyMutation, type Applied } from "./apply";

export class SyncGapError extends AppError {
  constructor(readonly expectedId: number) {
    super("conflict", `Changes are missing before this one: the server expects change ${expectedId} next.`, undefined, {
      reason: "gap",
      expectedId,
    });
  }
}

/** Test seam: runs inside the push's transaction after each write, before the watermark moves. */
export type PushHooks = { afterApply?: (tx: Transaction, m: Mutation, applied: Applied) => Promise<void> };

/** Locks (creating on first use) the device row; a device id owned by another user is refused. */
async function lockClient(tx: Transaction, clientId: string, user: SessionUser) {
  // One statement: creates the row on first use, and the no-op update locks it until commit.
  const [client] = await tx
    .insert(syncClients)
    .values({ id: clientId, userId: user.id })
    .onConflictDoUpdate({ target: syncClients.id, set: { lastMutationId: sql`${syncClients.lastMutationId}` } })
    .returning();
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
 * Applies the device's mutations in order, in ONE transaction for the whole push: the client row
 * is locked once, replays are answered from one read of the stored results, runs of creates are
 * written set-based (lib/records/create-batch.ts) and every other mutation goes one at a time
 * through the one write path in its own savepoint; then the results are stored in one statement
 * and the watermark moves once. A transient error rolls the whole push
 * back (503: the device sends it again, and nothing is doubled). A gap stops the push: what came
 * before it is committed, and the answer names the expected id.
 */

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
  try {
    return await pushOnce(user, request, hooks, true);
  } catch (error) {
    // The database refused a set-based write (a trigger, a row a racing device wrote); the whole
    // push was rolled back, so it runs again one mutation at a time, each in its own savepoint,
    // and each gets its own answer: one refusal does not hold back the others.
    if (error instanceof BatchRefused) return pushOnce(user, request, hooks, false);
    throw error;
  }
}

class BatchRefused extends Error {}

async function pushOnce(user: SessionUser, request: PushRequest, hooks: PushHooks, batch: boolean): Promise<PushResponse> {
  const mutations = [...request.mutations].sort((a, b) => a.id - b.id);
  const { clientId } = request;

  const outcome = await db.transaction(async (tx) => {
    const client = await lockClient(tx, clientId, user);
    const replayIds = mutations.filter((m) => m.id <= client.lastMutationId).map((m) => m.id);
    const stored = replayIds.length
      ? await tx.select().from(syncMutations).where(and(eq(syncMutations.clientId, clientId), inArray(syncMutations.mutationId, replayIds)))
      : [];
    const answers = new Map(stored.map((row) => [row.mutationId, storedResult(row)]));

    // The new mutations must follow the watermark without a hole (duplicates are answered twice).
    const fresh: Mutation[] = [];
    let expected = client.lastMutationId + 1;
    let gap: number | null = null;
    const answered: Mutation[] = [];
    for (const m of mutations) {
      if (m.id > expected) {
        gap = expected;
        break;
      }
      if (m.id === expected) {
        fresh.push(m);
        expected += 1;
      }
      answered.push(m);
    }

    const applied = await applyInOrder(tx, user, clientId, fresh, hooks, batch);
    if (fresh.length > 0) {
      const stored = insertStatements(
        syncMutations,
        fresh.map((m) => {
          const a = applied.get(m.id)!;
          return {
            clientId,
            mutationId: m.id,
            name: m.name,
            recordType: m.recordType,
            projectId: a === UNKNOWN_PROJECT ? null : m.projectId,
            recordId: m.recordId,
            args: keptArgs(a, m),
            baseVersion: m.baseVersion ?? null,
            result: a.result,
            reason: a.reason ?? null,
            message: a.message ?? null,
            version: a.version ?? null,
            conflictId: a.conflictId ?? null,
          };
        }),
      );
      // The stored results and the watermark in one statement (the results as a WITH of the update).
      for (const statement of stored.slice(0, -1)) await tx.execute(statement);
      await tx.execute(sql`with stored as (${stored.at(-1)})
        update ${syncClients} set ${sql.identifier(syncClients.lastMutationId.name)} = ${expected - 1}, ${sql.identifier(syncClients.lastSeenAt.name)} = now()
        where ${syncClients.id} = ${clientId}`);
    }
    for (const [id, a] of applied) answers.set(id, { id, ...a } satisfies MutationResult);
    const results = answered.map((m) => answers.get(m.id) ?? ({ id: m.id, result: "applied" } as MutationResult));
    return { lastMutationId: expected - 1, results, gap };
  });

  if (outcome.gap !== null) throw new SyncGapError(outcome.gap);
  return { lastMutationId: outcome.lastMutationId, results: outcome.results };
}

/** Runs of creates set-based (when `batch`), everything else one by one; results by mutation id. */
async function applyInOrder(tx: Transaction, user: SessionUser, clientId: string, fresh: Mutation[], hooks: PushHooks, batch: boolean) {
  const applied = new Map<number, Applied>();
  // The push's door: the sender's access to every project it names, resolved once and handed to
  // each write. A project the sender does not belong to (or that does not exist) is refused before
  // any write, like the project routes: the same answer for both, and nothing of the sender's is kept.
  const roles = await resolveMemberAccess(user, [...new Set(fresh.map((m) => m.projectId))], tx);
  const ctx = { user, access: roles, deviceId: clientId, tx };
  let i = 0;
  while (i < fresh.length) {
    if (!roles.has(fresh[i].projectId)) {
      const m = fresh[i];
      await hooks.afterApply?.(tx, m, UNKNOWN_PROJECT);
      applied.set(m.id, UNKNOWN_PROJECT);
      i += 1;
      continue;
    }
    const creates: CreateInput[] = [];
    for (const m of batch ? fresh.slice(i) : []) {
      if (m.name !== "create" || !roles.has(m.projectId)) break;
      creates.push({ type: m.recordType, projectId: m.projectId, input: { ...m.args, id: m.recordId } });
    }
    const plan = creates.length ? await planCreates(tx, ctx, creates) : [];
    if (plan.length === 0) {
      const m = fresh[i];
      const a = await applyMutation(tx, user, clientId, m, roles);
      await hooks.afterApply?.(tx, m, a);
      applied.set(m.id, a);
      i += 1;
      continue;
    }
    const run = fresh.slice(i, i + plan.length);
    i += plan.length;
    let rows;
    try {
      rows = await writeCreates(tx, ctx, plan);
    } catch (error) {
      throw isTransient(error) ? error : new BatchRefused("set-based write refused", { cause: error });
    }
    for (const [k, m] of run.entries()) {
      const a: Applied = { result: "applied", version: rows[k].version };
      await hooks.afterApply?.(tx, m, a);
      applied.set(m.id, a);
    }
  }
  return applied;
}
