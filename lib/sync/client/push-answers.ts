// What the device does with the server's answer to each change it sent: applied → the entry leaves
// the outbox and the server copy includes it; conflict or rejected → the entry leaves the outbox
// and the device keeps a copy in `conflicts`. A change queued behind it gets its base version here.
import type { MutationResult, PushResponse } from "@/lib/sync/protocol";
import { getMeta, setMeta, type ConflictRow, type OutboxEntry, type SyncDb } from "./db";
import { applyEntry, rebuildRecord } from "./replay";
import { MESSAGES } from "./sync-http";

/** Applies the server's answers (one transaction). */
export async function applyResults(
  db: SyncDb,
  clientId: string,
  batch: OutboxEntry[],
  response: PushResponse,
  now: string,
): Promise<{ applied: number; conflicts: number; rejected: number; more: boolean }> {
  const counts = { applied: 0, conflicts: 0, rejected: 0 };
  const byId = new Map<number, MutationResult>(response.results.map((result) => [result.id, result]));
  const more = await db.transaction("rw", db.syncTables(), async () => {
    for (const sent of batch) {
      const result = byId.get(sent.mutationId);
      const entry = await db.outbox.get(sent.seq!);
      if (!entry) continue; // already acknowledged by a pull
      if (!result) {
        entry.state = "pending";
        entry.lastError = MESSAGES.noAnswer;
        await db.outbox.put(entry);
        continue;
      }
      const table = db.records(entry.recordType);
      let successorBase: number;
      if (result.result === "applied") {
        counts.applied += 1;
        const version = result.version ?? (entry.baseVersion !== undefined ? entry.baseVersion + 1 : 1);
        // The server copy now includes this change (the next pull brings the exact row).
        const row = await table.get(entry.recordId);
        if (row) {
          const copy = applyEntry(row.serverCopy ?? undefined, entry, db.userId);
          if (copy) await table.put({ ...row, serverCopy: { ...copy, version } });
        }
        successorBase = version;
      } else {
        if (result.result === "conflict") counts.conflicts += 1;
        else counts.rejected += 1;
        const conflict: ConflictRow = {
          id: result.conflictId ?? `${result.result}-${clientId}-${entry.mutationId}`,
          projectId: entry.projectId,
          recordType: entry.recordType,
          recordId: entry.recordId,
          baseVersion: entry.baseVersion ?? null,
          serverVersion: result.result === "conflict" ? (result.version ?? null) : null,
          clientPayload: { name: entry.name, args: entry.args },
          serverPayload: null,
          reason: result.reason ?? result.result,
          createdAt: now,
          kind: result.result,
          source: "push",
          message: result.message,
          mutationId: entry.mutationId,
          mutationName: entry.name,
        };
        await db.conflicts.put(conflict);
        // A change built on this one must not overwrite whatever the server has now.
        successorBase = entry.baseVersion ?? 1;
      }
      await db.outbox.delete(entry.seq!);
      const successor = await db.outbox
        .where("[recordType+recordId]")
        .equals([entry.recordType, entry.recordId])
        .filter((other) => other.seq! > entry.seq!)
        .sortBy("seq");
      const next = successor[0];
      if (next && next.name !== "create" && next.baseVersion === undefined) {
        next.baseVersion = successorBase;
        await db.outbox.put(next);
      }
      await rebuildRecord(db, entry.recordType, entry.recordId);
    }
    const last = (await getMeta(db, "lastMutationId")) ?? 0;
    if (response.lastMutationId > last) await setMeta(db, "lastMutationId", response.lastMutationId);
    return (await db.outbox.count()) > 0;
  });
  return { ...counts, more };
}
