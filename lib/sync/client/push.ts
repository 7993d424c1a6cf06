// Sending the outbox (SYNC.md "POST /api/sync/push"): the waiting entries in order, at most
// MAX_MUTATIONS_PER_PUSH at a time. The device keeps every entry until the server has said what became
// of it (promise 1): applied → the entry leaves the outbox; conflict or rejected → the server has
// stored the payload when it answers, so the entry leaves the outbox and the device keeps a copy in
// `conflicts` for the person to see. Anything else keeps every entry:
// - 409 gap: a device bug (an id is missing). Logged; the entries from the expected id on are
//   renumbered (the server applied nothing after the gap, so none of them has been applied) and sent
//   again. Nothing is dropped.
// - 401: stop and ask the person to sign in again.
// - 503 / network error / 429 / 502 / 504: transient, back off.
// - other statuses: the entries are marked failed with the server's words, and retried with back-off.
//
// A change queued without a base version (it follows another waiting change to the same record, see
// mutate.ts) is never sent in the same batch as that change: it waits for the answer, which fixes its
// base version.
import {
  MAX_MUTATIONS_PER_PUSH,
  SYNC_SCHEMA_VERSION,
  type PushRequest,
  type PushResponse,
} from "@/lib/sync/protocol";
import { ensureMeta, setMeta, type OutboxEntry, type SyncDb } from "./db";
import { applyResults } from "./push-answers";
import { MESSAGES, postSyncJson, type FetchLike } from "./sync-http";

export { MESSAGES, postSyncJson, type FetchLike } from "./sync-http";

export type PushOptions = {
  fetch: FetchLike;
  /** Default /api/sync/push. */
  url?: string;
  /**
   * Entries left "sending" by a push that never finished (a closed tab) are sent again when older
   * than this. The leading tab (Web Locks) passes 0: no other tab can be sending.
   */
  recoverSendingAfterMs?: number;
  now?: () => Date;
};

export type PushOutcome =
  | { kind: "idle" }
  | { kind: "ok"; sent: number; applied: number; conflicts: number; rejected: number; more: boolean }
  | { kind: "gap"; expectedId: number; message: string }
  | { kind: "unauthenticated"; message: string }
  | { kind: "transient"; message: string; status?: number }
  | { kind: "failed"; message: string; status: number };

const TRANSIENT_STATUSES = new Set([408, 429, 502, 503, 504]);

const recordKey = (entry: Pick<OutboxEntry, "recordType" | "recordId">) => `${entry.recordType}\u0000${entry.recordId}`;

/** Picks the next batch and marks it "sending" (one transaction). */
async function takeBatch(db: SyncDb, options: PushOptions): Promise<OutboxEntry[]> {
  const now = (options.now ?? (() => new Date()))();
  const recoverBefore = now.getTime() - (options.recoverSendingAfterMs ?? 0);
  return db.transaction("rw", db.syncTables(), async () => {
    const entries = await db.outbox.orderBy("seq").toArray();
    const batch: OutboxEntry[] = [];
    const seen = new Set<string>();
    for (const entry of entries) {
      if (batch.length >= MAX_MUTATIONS_PER_PUSH) break;
      if (entry.state === "sending") {
        const sentAt = entry.lastAttemptAt ? Date.parse(entry.lastAttemptAt) : 0;
        // Order per device: nothing may overtake a change that may still be on its way.
        if (sentAt > recoverBefore) break;
      }
      const key = recordKey(entry);
      // A second change to a record already in this batch waits for the first one's answer.
      if (seen.has(key)) break;
      if (entry.name !== "create" && entry.baseVersion === undefined) {
        // Its predecessor was answered without telling us (acknowledged by a pull): use what we know.
        const row = await db.records(entry.recordType).get(entry.recordId);
        entry.baseVersion = row && row.version >= 1 ? row.version : 1;
      }
      seen.add(key);
      batch.push(entry);
    }
    for (const entry of batch) {
      entry.state = "sending";
      entry.attempts += 1;
      entry.lastAttemptAt = now.toISOString();
    }
    await db.outbox.bulkPut(batch);
    return batch;
  });
}

/** Puts the batch back in the queue with a reason (nothing is dropped). */
async function releaseBatch(db: SyncDb, batch: OutboxEntry[], state: "pending" | "failed", message: string) {
  await db.transaction("rw", db.outbox, async () => {
    for (const sent of batch) {
      const entry = await db.outbox.get(sent.seq!);
      if (!entry) continue;
      entry.state = state;
      entry.lastError = message;
      await db.outbox.put(entry);
    }
  });
}

async function readError(res: Response): Promise<{ message?: string; reason?: string; expectedId?: number }> {
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; reason?: string; expectedId?: number } } | null;
  return body?.error ?? {};
}

/** Sends one batch. */
export async function pushOnce(db: SyncDb, options: PushOptions): Promise<PushOutcome> {
  const { clientId } = await ensureMeta(db, SYNC_SCHEMA_VERSION);
  const batch = await takeBatch(db, options);
  if (batch.length === 0) return { kind: "idle" };

  const body: PushRequest = {
    clientId,
    schemaVersion: SYNC_SCHEMA_VERSION,
    mutations: batch.map((entry) => ({
      id: entry.mutationId,
      name: entry.name,
      recordType: entry.recordType,
      projectId: entry.projectId,
      recordId: entry.recordId,
      args: entry.args,
      ...(entry.baseVersion !== undefined ? { baseVersion: entry.baseVersion } : {}),
    })),
  };

  const res = await postSyncJson(options.fetch, options.url ?? "/api/sync/push", body);
  if (!res) {
    await releaseBatch(db, batch, "pending", MESSAGES.offline);
    return { kind: "transient", message: MESSAGES.offline };
  }

  if (res.status === 200) {
    const json = (await res.json().catch(() => null)) as PushResponse | null;
    if (!json || !Array.isArray(json.results) || typeof json.lastMutationId !== "number") {
      const message = "The server's answer could not be read; the changes will be sent again.";
      await releaseBatch(db, batch, "failed", message);
      return { kind: "failed", message, status: 200 };
    }
    const now = (options.now ?? (() => new Date()))().toISOString();
    return { kind: "ok", sent: batch.length, ...(await applyResults(db, clientId, batch, json, now)) };
  }
  if (res.status === 401) {
    await releaseBatch(db, batch, "pending", MESSAGES.signIn);
    return { kind: "unauthenticated", message: MESSAGES.signIn };
  }
  if (res.status === 409) {
    const error = await readError(res);
    if (error.reason === "gap" && typeof error.expectedId === "number") {
      console.error(`sync: the server expected change ${error.expectedId}; resending in order`, error.message);
      await renumberFrom(db, error.expectedId, MESSAGES.gap);
      return { kind: "gap", expectedId: error.expectedId, message: MESSAGES.gap };
    }
    const message = error.message ?? "The server refused these changes; they stay on this device.";
    await releaseBatch(db, batch, "failed", message);
    return { kind: "failed", message, status: 409 };
  }
  if (TRANSIENT_STATUSES.has(res.status)) {
    await releaseBatch(db, batch, "pending", MESSAGES.busy);
    return { kind: "transient", message: MESSAGES.busy, status: res.status };
  }
  const error = await readError(res);
  const message = error.message
    ? `${error.message} Your changes stay on this device.`
    : `The server answered ${res.status}. Your changes stay on this device and will be sent again.`;
  await releaseBatch(db, batch, "failed", message);
  return { kind: "failed", message, status: res.status };
}

/**
 * After a gap: the entries from `expectedId` on get consecutive ids starting there (the server
 * applied none of them). Entries below it are replays the server answers from its stored results.
 */
async function renumberFrom(db: SyncDb, expectedId: number, message: string) {
  await db.transaction("rw", db.outbox, db.meta, async () => {
    const entries = await db.outbox.orderBy("seq").toArray();
    let id = expectedId;
    for (const entry of entries) {
      entry.state = "pending";
      entry.lastError = message;
      // Ids only move down (they are increasing integers), so the unique index never collides.
      if (entry.mutationId >= expectedId) {
        entry.mutationId = id;
        id += 1;
      }
      await db.outbox.put(entry);
    }
    await setMeta(db, "nextMutationId", id);
  });
}

/** Sends batches until the outbox is empty or a batch fails. */
export async function pushAll(db: SyncDb, options: PushOptions, maxBatches = 1_000): Promise<PushOutcome> {
  const total = { sent: 0, applied: 0, conflicts: 0, rejected: 0 };
  let last: PushOutcome = { kind: "idle" };
  for (let i = 0; i < maxBatches; i += 1) {
    const outcome = await pushOnce(db, options);
    if (outcome.kind !== "ok") {
      if (outcome.kind === "idle" && total.sent > 0) return { kind: "ok", ...total, more: false };
      return outcome;
    }
    total.sent += outcome.sent;
    total.applied += outcome.applied;
    total.conflicts += outcome.conflicts;
    total.rejected += outcome.rejected;
    last = { kind: "ok", ...total, more: outcome.more };
    if (!outcome.more) return last;
  }
  return last;
}
