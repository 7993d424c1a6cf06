// Applying one page of a pull, in ONE Dexie transaction (SYNC.md "POST /api/sync/pull"):
// 1. reset → clear the synced tables (records, projects); the outbox is kept;
// 2. drop the outbox entries the server has acknowledged (mutationId ≤ lastMutationId);
// 3. upsert the changed rows as the new server copies, and RE-APPLY the entries still waiting on top,
//    so a pending local edit is never overwritten by an older server copy;
// 4. rebuild the rows whose entries were dropped (their `pending` flag clears with the last entry);
// 5. store the projects and the open conflicts, and save the cursor.
// Tombstones are kept as rows (deletedAt set); lib/sync/client/queries.ts leaves them out.
import type { PullResponse, SyncedRecord } from "@/lib/sync/protocol";
import { getMeta, setMeta, type ConflictRow, type LocalRecord, type OutboxEntry, type SyncDb } from "./db";
import { isLocalRecordType, LOCAL_RECORD_TYPES, type RecordType } from "./record-types";
import { replayRow } from "./replay";

export type ApplyPullResult = { applied: number; acknowledged: number; reset: boolean; hasMore: boolean };

const keyOf = (type: string, id: string) => `${type}\u0000${id}`;

export async function applyPull(db: SyncDb, response: PullResponse): Promise<ApplyPullResult> {
  return db.transaction("rw", db.syncTables(), async () => {
    if (response.reset) {
      await Promise.all(db.recordTables().map((table) => table.clear()));
      await db.projects.clear();
    }

    // Acknowledged entries leave the outbox; the records they touched are rebuilt below.
    const acknowledged = await db.outbox.where("mutationId").belowOrEqual(response.lastMutationId).toArray();
    await db.outbox.bulkDelete(acknowledged.map((entry) => entry.seq!));
    const next = (await getMeta(db, "nextMutationId")) ?? 1;
    if (next <= response.lastMutationId) await setMeta(db, "nextMutationId", response.lastMutationId + 1);
    await setMeta(db, "lastMutationId", response.lastMutationId);

    const waiting = new Map<string, OutboxEntry[]>();
    for (const entry of await db.outbox.orderBy("seq").toArray()) {
      const key = keyOf(entry.recordType, entry.recordId);
      waiting.set(key, [...(waiting.get(key) ?? []), entry]);
    }

    // Fresh server copies, with the waiting entries re-applied.
    const touched = new Set<string>();
    const puts = new Map<RecordType, LocalRecord[]>();
    let applied = 0;
    for (const change of response.changes) {
      if (!isLocalRecordType(change.recordType)) continue;
      const key = keyOf(change.recordType, change.record.id);
      touched.add(key);
      const row = replayRow(change.record as SyncedRecord, waiting.get(key) ?? [], db.userId);
      if (row) puts.set(change.recordType, [...(puts.get(change.recordType) ?? []), row]);
      applied += 1;
    }
    for (const [type, rows] of puts) await db.records(type).bulkPut(rows);

    // Rows whose entries were acknowledged, and (after a reset) rows that exist only in the outbox.
    const rebuild = new Map<string, { type: RecordType; id: string }>();
    for (const entry of acknowledged) rebuild.set(keyOf(entry.recordType, entry.recordId), { type: entry.recordType, id: entry.recordId });
    if (response.reset) {
      for (const entries of waiting.values()) rebuild.set(keyOf(entries[0].recordType, entries[0].recordId), { type: entries[0].recordType, id: entries[0].recordId });
    }
    for (const [key, { type, id }] of rebuild) {
      if (touched.has(key) || !LOCAL_RECORD_TYPES.includes(type)) continue;
      const table = db.records(type);
      const current = await table.get(id);
      const row = replayRow(current?.serverCopy ?? null, waiting.get(key) ?? [], db.userId);
      if (row) await table.put(row);
      else if (current) await table.delete(id);
    }

    if (response.reset || response.projects.length > 0) {
      await db.projects.clear();
      await db.projects.bulkPut(response.projects);
    }

    // The server's list of open conflicts replaces every conflict the device knew; refused changes stay.
    // A conflict this device has already answered (its "resolve" still waits) is not shown again.
    const answered = new Set<unknown>();
    for (const entries of waiting.values()) for (const entry of entries) if (entry.name === "resolve") answered.add(entry.args.conflictId);
    await db.conflicts.where("kind").equals("conflict").delete();
    const conflicts: ConflictRow[] = response.conflicts
      .filter((conflict) => !answered.has(conflict.id))
      .map((conflict) => ({ ...conflict, kind: "conflict", source: "server" }));
    await db.conflicts.bulkPut(conflicts);

    await setMeta(db, "cursor", response.cursor);
    return { applied, acknowledged: acknowledged.length, reset: response.reset, hasMore: response.hasMore };
  });
}
