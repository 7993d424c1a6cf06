// A person's answer to a conflict on the device (mutation "resolve").
import type { SyncDb } from "./db";
import { LocalWriteError, validationError } from "./errors";
import { appendEntry, parseOrThrow, recordValues, writeTx, type WriteResult } from "./local-write";
import { isLocalRecordType, localDef } from "./record-types";
import { entriesFor, rebuildRecord, toWire } from "./replay";
import { assertNotSigned } from "./signed-freeze";

/**
 * A person's answer to a conflict (mutation "resolve"): `patch` holds the values kept, field by field
 * (empty: keep the server's values). The server applies it onto the version the person saw
 * (`baseVersion`, default the record's version as last pulled) and closes the conflict; the conflict
 * leaves this device's list at once and does not come back with a pull while the answer waits.
 */
export async function resolveConflictLocal(
  db: SyncDb,
  conflictId: string,
  patch: Record<string, unknown> = {},
  options: { baseVersion?: number } = {},
): Promise<WriteResult> {
  const conflict = await db.conflicts.get(conflictId);
  if (!conflict) throw new LocalWriteError("not_found", "That conflict is no longer open on this device.");
  if (!isLocalRecordType(conflict.recordType)) throw new LocalWriteError("not_found", "This app version does not know that record type.");
  const recordType = conflict.recordType;
  const def = localDef(recordType);
  const parsed = Object.keys(patch).length > 0 ? toWire(parseOrThrow(def.update, patch)) : {};
  const result = await writeTx(db, async () => {
    const row = await db.records(recordType).get(conflict.recordId);
    if (Object.keys(parsed).length > 0) {
      if (!row || row.deletedAt) throw new LocalWriteError("deleted", `This ${def.label.toLowerCase()} was deleted, so no values can be kept.`);
      await assertNotSigned(db, recordType, row);
      const merged = def.create.safeParse({ ...recordValues(row), ...parsed });
      if (!merged.success) throw validationError(merged.error);
    }
    const waiting = await entriesFor(db, recordType, conflict.recordId);
    const acknowledged = row && row.version >= 1 ? row.version : (conflict.serverVersion ?? 1);
    const mutationId = await appendEntry(db, {
      name: "resolve",
      recordType,
      projectId: conflict.projectId,
      recordId: conflict.recordId,
      args: { conflictId, patch: parsed },
      baseVersion: options.baseVersion ?? (waiting.length > 0 ? undefined : acknowledged),
    });
    await db.conflicts.delete(conflictId);
    await rebuildRecord(db, recordType, conflict.recordId);
    return { id: conflict.recordId, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}
