// What every write function of the device shares (mutate.ts, transition.ts, resolve.ts,
// site-visits.ts): the outbox entry with the next mutation id, the base version, the live row, the
// one transaction over every sync table. SYNC.md "Write rule".
import type { z } from "zod";
import { getMeta, setMeta, type LocalRecord, type OutboxEntry, type SyncDb } from "./db";
import { LocalWriteError, validationError } from "./errors";
import { localDef, type RecordType } from "./record-types";

export type WriteResult = {
  /** The record's id (made on the device for a create). */
  id: string;
  /** The outbox entry that carries the change (an earlier one when the change was merged into it). */
  mutationId: number;
  /** True when the change was merged into a waiting create or update instead of a new entry. */
  merged: boolean;
};

/** A UUID for a record made on this device. */
export function newRecordId(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  // Insecure contexts have no randomUUID; build a version-4 UUID from random bytes.
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

export function parseOrThrow<T>(schema: z.ZodType<T>, input: unknown): T {
  const result = schema.safeParse(input);
  if (!result.success) throw validationError(result.error);
  return result.data;
}

/** Takes the next mutation id and queues the entry (inside the caller's transaction). */
export async function appendEntry(
  db: SyncDb,
  entry: Pick<OutboxEntry, "name" | "recordType" | "projectId" | "recordId" | "args" | "baseVersion">,
): Promise<number> {
  const mutationId = (await getMeta(db, "nextMutationId")) ?? 1;
  await setMeta(db, "nextMutationId", mutationId + 1);
  const full: OutboxEntry = {
    ...entry,
    mutationId,
    attempts: 0,
    lastError: null,
    lastAttemptAt: null,
    createdAt: new Date().toISOString(),
    state: "pending",
  };
  if (full.baseVersion === undefined) delete full.baseVersion;
  await db.outbox.add(full);
  return mutationId;
}

/** The base version of a new change: the acknowledged version, or none when a change is still waiting. */
export function baseVersionFor(row: LocalRecord, waiting: readonly OutboxEntry[]): number | undefined {
  if (waiting.length > 0) return undefined;
  return row.version >= 1 ? row.version : undefined;
}

export async function loadLive(db: SyncDb, type: RecordType, id: string): Promise<LocalRecord> {
  const def = localDef(type);
  const row = await db.records(type).get(id);
  if (!row) throw new LocalWriteError("not_found", `${def.label} not found on this device.`);
  if (row.deletedAt) throw new LocalWriteError("deleted", `This ${def.label.toLowerCase()} was deleted.`);
  return row;
}

export function writeTx<T>(db: SyncDb, fn: () => Promise<T>): Promise<T> {
  return db.transaction("rw", db.syncTables(), fn);
}

/** The fields of a stored row the create schema knows (the sync bookkeeping left out). */
export function recordValues(row: LocalRecord): Record<string, unknown> {
  const values: Record<string, unknown> = { ...row };
  delete values.pending;
  delete values.serverCopy;
  return values;
}

