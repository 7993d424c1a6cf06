// The one way the device writes a record (SYNC.md "Write rule"): validate with the shared zod schema,
// then, in ONE Dexie transaction, write the optimistic row AND its outbox entry, taking the next
// mutation id from meta inside that transaction. Invalid input throws LocalValidationError and
// writes nothing. After the commit the sync driver is asked to sync shortly (debounced).
//
// Base versions. Every change carries the version of the record the person edited, as the server last
// acknowledged it. A change that follows another change to the same record that has not been
// answered yet cannot know that version, so:
// - an update of a record whose latest waiting change is a create or an update that has never been
//   sent is MERGED into that change (into the create's values, or into the update's patch). No new
//   mutation id is used; the merged change is what the server receives. A change that has been sent
//   once is never altered (the server may have stored it already).
// - otherwise the new entry is queued without a base version; push.ts fills it in from the answer to
//   the change before it (applied → the version it produced; conflict or refused → that change's own
//   base version, so an edit built on a refused edit also conflicts instead of overwriting silently).
//   So an update sent after the create of a record made on this device carries baseVersion 1.
import type { SyncDb } from "./db";
import { LocalWriteError, validationError } from "./errors";
import { appendEntry, baseVersionFor, loadLive, newRecordId, parseOrThrow, recordValues, writeTx, type WriteResult } from "./local-write";
import { localDef, type RecordType } from "./record-types";
import { entriesFor, rebuildRecord, toWire } from "./replay";
import { assertNotSigned } from "./signed-freeze";

export { newRecordId, writeTx, type WriteResult } from "./local-write";
export { resolveConflictLocal } from "./resolve";
export { transitionArgsSchema, transitionLocal } from "./transition";

/**
 * Creates a record on the device. `values` is the form's input for the type's create schema; an `id`
 * may be given (a UUID made earlier, e.g. to link children before saving), otherwise one is made.
 */
export async function createLocal(
  db: SyncDb,
  recordType: RecordType,
  projectId: string,
  values: Record<string, unknown>,
): Promise<WriteResult> {
  const def = localDef(recordType);
  const id = typeof values.id === "string" && values.id ? values.id : newRecordId();
  const args = toWire(parseOrThrow(def.create, { ...values, id }));
  if (!projectId) throw new LocalWriteError("invalid_input", "Choose a project first.", { projectId: "Choose a project first" });
  const result = await writeTx(db, async () => {
    if (await db.records(recordType).get(id)) {
      throw new LocalWriteError("state", `A ${def.label.toLowerCase()} with this id already exists on this device.`);
    }
    const parentId = def.parent ? args[def.parent.field] : undefined;
    if (def.parent && typeof parentId === "string") {
      const parentType = def.parent.type;
      const parent = await db.records(parentType).get(parentId);
      if (parent?.deletedAt) throw new LocalWriteError("deleted", `The ${localDef(parentType).label.toLowerCase()} was deleted.`);
      if (parent && parent.projectId !== projectId) {
        throw new LocalWriteError("invalid_input", `The ${localDef(parentType).label.toLowerCase()} belongs to another project.`);
      }
    }
    await assertNotSigned(db, recordType, args);
    const mutationId = await appendEntry(db, { name: "create", recordType, projectId, recordId: id, args });
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}

/** Changes fields of a record. `patch` is validated with the type's update schema. */
export async function updateLocal(
  db: SyncDb,
  recordType: RecordType,
  id: string,
  patch: Record<string, unknown>,
): Promise<WriteResult> {
  const def = localDef(recordType);
  const parsed = toWire(parseOrThrow(def.update, patch));
  if (Object.keys(parsed).length === 0) {
    throw new LocalWriteError("invalid_input", "Nothing to change: change at least one field.", { _: "Change at least one field" });
  }
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, recordType, id);
    await assertNotSigned(db, recordType, row);
    // The whole record must still make sense (the server checks the same after merging).
    const merged = def.create.safeParse({ ...recordValues(row), ...parsed });
    if (!merged.success) throw validationError(merged.error);

    const waiting = await entriesFor(db, recordType, id);
    const latest = waiting.at(-1);
    let mutationId: number;
    let wasMerged = false;
    if (latest && latest.state === "pending" && latest.attempts === 0 && (latest.name === "create" || latest.name === "update")) {
      latest.args =
        latest.name === "create"
          ? { ...latest.args, ...parsed }
          : { patch: { ...((latest.args.patch ?? {}) as Record<string, unknown>), ...parsed } };
      await db.outbox.put(latest);
      mutationId = latest.mutationId;
      wasMerged = true;
    } else {
      mutationId = await appendEntry(db, {
        name: "update",
        recordType,
        projectId: row.projectId,
        recordId: id,
        args: { patch: parsed },
        baseVersion: baseVersionFor(row, waiting),
      });
    }
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: wasMerged };
  });
  db.notifyLocalWrite();
  return result;
}

/** Deletes a record (a tombstone on the server; children follow their parent there). */
export async function deleteLocal(db: SyncDb, recordType: RecordType, id: string): Promise<WriteResult> {
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, recordType, id);
    await assertNotSigned(db, recordType, row);
    if (recordType === "placements" && ["placing", "placed", "signed"].includes(row.state as string)) {
      throw new LocalWriteError("state", "Concrete has been placed here, so the placement cannot be deleted; correct it instead.");
    }
    const waiting = await entriesFor(db, recordType, id);
    const mutationId = await appendEntry(db, {
      name: "delete",
      recordType,
      projectId: row.projectId,
      recordId: id,
      args: {},
      baseVersion: baseVersionFor(row, waiting),
    });
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}

