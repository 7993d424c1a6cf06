// How an outbox entry changes a row, and rebuilding a visible row from the server's copy plus the
// entries still waiting. Used by the write functions (optimistic change), the pull (re-apply pending
// changes on top of fresh server rows) and the push (undo a refused change).
import type { SyncedRecord } from "@/lib/sync/protocol";
import type { LocalRecord, OutboxEntry, SyncDb } from "./db";
import { localDef, type RecordType } from "./record-types";
import { applyLifecycleEntry } from "./site-visits-replay";

/** The wire form of values: dates as ISO strings, no undefined (what JSON would carry). */
export function toWire<T>(value: T): T {
  if (value instanceof Date) return value.toISOString() as T;
  if (Array.isArray(value)) return value.map((item) => toWire(item)) as T;
  if (value && typeof value === "object") {
    const out: Record<string, unknown> = {};
    for (const [key, item] of Object.entries(value as Record<string, unknown>)) {
      if (item !== undefined) out[key] = toWire(item);
    }
    return out as T;
  }
  return value;
}

/**
 * The row after applying one change (undefined: no row). Mirrors what the server does:
 * create inserts (server defaults first), update merges the patch, delete sets the tombstone,
 * transition changes the placement's state, resolve applies the values kept. A change to a missing row leaves it missing (the server
 * will refuse it as not found).
 */
export function applyEntry(row: SyncedRecord | undefined, entry: OutboxEntry, userId: string | null): SyncedRecord | undefined {
  switch (entry.name) {
    case "create": {
      if (row) return { ...row, ...stripId(entry.args) };
      return {
        ...localDef(entry.recordType).defaults,
        ...entry.args,
        id: entry.recordId,
        projectId: entry.projectId,
        version: 0,
        changeSeq: 0,
        deletedAt: null,
        createdAt: entry.createdAt,
        updatedAt: entry.createdAt,
        updatedBy: userId,
      };
    }
    case "update": {
      if (!row) return undefined;
      const patch = (entry.args.patch ?? {}) as Record<string, unknown>;
      return { ...row, ...patch, updatedAt: entry.createdAt, updatedBy: userId };
    }
    case "delete": {
      if (!row) return undefined;
      return { ...row, deletedAt: row.deletedAt ?? entry.createdAt, updatedAt: entry.createdAt, updatedBy: userId };
    }
    case "resolve": {
      // The person's answer to a conflict: the values kept (none: the server's values stay).
      if (!row) return undefined;
      const patch = (entry.args.patch ?? {}) as Record<string, unknown>;
      if (Object.keys(patch).length === 0) return row;
      return { ...row, ...patch, updatedAt: entry.createdAt, updatedBy: userId };
    }
    case "transition": {
      if (!row) return undefined;
      if (entry.recordType === "site-visits" || entry.recordType === "findings") return applyLifecycleEntry(row, entry, userId);
      const to = entry.args.to as string;
      const reason = (entry.args.reason as string | undefined) ?? null;
      return { ...row, state: to, holdReason: to === "held" ? reason : null, updatedAt: entry.createdAt, updatedBy: userId };
    }
  }
}

function stripId(args: Record<string, unknown>): Record<string, unknown> {
  const rest = { ...args };
  delete rest.id;
  return rest;
}

/** The visible row: the server copy with the waiting entries (in order) on top. */
export function replayRow(
  serverCopy: SyncedRecord | null,
  entries: readonly OutboxEntry[],
  userId: string | null,
): LocalRecord | undefined {
  let row: SyncedRecord | undefined = serverCopy ?? undefined;
  for (const entry of entries) row = applyEntry(row, entry, userId);
  if (!row) return undefined;
  const visible = { ...row } as LocalRecord;
  delete (visible as Partial<LocalRecord>).serverCopy;
  visible.pending = entries.length > 0 ? 1 : 0;
  visible.serverCopy = serverCopy;
  // The version stays the one the server acknowledged: local edits never invent versions.
  visible.version = serverCopy?.version ?? 0;
  visible.changeSeq = serverCopy?.changeSeq ?? 0;
  return visible;
}

/** The outbox entries still waiting for one record, oldest first. */
export async function entriesFor(db: SyncDb, type: RecordType, id: string): Promise<OutboxEntry[]> {
  const entries = await db.outbox.where("[recordType+recordId]").equals([type, id]).toArray();
  return entries.sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0));
}

/**
 * Rewrites the visible row of one record from its server copy and its waiting entries. Must run
 * inside a transaction that covers the record's table and the outbox.
 * `serverCopy` undefined: keep the copy the row already has.
 */
export async function rebuildRecord(db: SyncDb, type: RecordType, id: string, serverCopy?: SyncedRecord | null): Promise<void> {
  const table = db.records(type);
  const current = await table.get(id);
  const base = serverCopy === undefined ? (current?.serverCopy ?? null) : serverCopy;
  const row = replayRow(base, await entriesFor(db, type, id), db.userId);
  if (row) await table.put(row);
  else if (current) await table.delete(id);
}
