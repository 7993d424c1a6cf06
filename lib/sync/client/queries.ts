// Reads for the screens (use them inside useLiveQuery). They leave tombstones out: a deleted record
// stays in its table (deletedAt set) until the server forgets it, but is never shown.
import type { ConflictRow, LocalRecord, OutboxEntry, ProjectRow, SyncDb } from "./db";
import { getMeta } from "./db";
import type { ParentField, RecordType } from "./record-types";

const live = <R extends LocalRecord>(row: R | undefined): row is R => !!row && !row.deletedAt;

/** One record, or undefined when it does not exist or was deleted. */
export async function getRecord<T extends RecordType>(db: SyncDb, type: T, id: string | null | undefined): Promise<LocalRecord<T> | undefined> {
  if (!id) return undefined;
  const row = await db.typedRecords(type).get(id);
  return live(row) ? row : undefined;
}

/** The records of a project (not deleted). */
export async function listByProject<T extends RecordType>(db: SyncDb, type: T, projectId: string): Promise<LocalRecord<T>[]> {
  return db.typedRecords(type).where("projectId").equals(projectId).filter((row) => !row.deletedAt).toArray();
}

/** The records hanging off a parent: deliveries of a placement, crew lines of a diary entry … */
export async function listByParent<T extends RecordType>(db: SyncDb, type: T, field: ParentField, parentId: string): Promise<LocalRecord<T>[]> {
  return db.typedRecords(type).where(field).equals(parentId).filter((row) => !row.deletedAt).toArray();
}

export async function listProjects(db: SyncDb): Promise<ProjectRow[]> {
  return db.projects.toArray();
}

/** The waiting changes, oldest first. */
export async function listOutbox(db: SyncDb): Promise<OutboxEntry[]> {
  return db.outbox.orderBy("seq").toArray();
}

export async function listConflicts(db: SyncDb, kind: ConflictRow["kind"] = "conflict"): Promise<ConflictRow[]> {
  return db.conflicts.where("kind").equals(kind).toArray();
}

/** Removes a refused change from the list once the person has read it (the server keeps its copy). */
export async function dismissRejection(db: SyncDb, id: string): Promise<void> {
  await db.conflicts.where("id").equals(id).and((row) => row.kind === "rejected").delete();
}

export type SyncSummary = {
  /** Changes not yet acknowledged by the server. */
  waiting: number;
  /** Of those, the ones whose last attempt failed with an error that is not just "offline". */
  failed: number;
  /** Open conflicts to resolve. */
  conflicts: number;
  /** Changes the server refused (kept on the server; listed here until dismissed). */
  rejected: number;
  /** Photos on this device whose bytes have not been stored yet (the photo lane, lib/photos/client). */
  photosWaiting: number;
  /** Of those, the ones whose last upload failed. */
  photosFailed: number;
  lastSyncAt: string | null;
  lastError: string | null;
};

/** The numbers the sync status control shows (read live). */
export async function readSyncSummary(db: SyncDb): Promise<SyncSummary> {
  return db.transaction("r", [db.outbox, db.conflicts, db.meta, db.blobs], async () => {
    const [waiting, failed, conflicts, rejected, blobs, blobsStored, photosFailed, lastSyncAt, lastError] = await Promise.all([
      db.outbox.count(),
      db.outbox.where("state").equals("failed").count(),
      db.conflicts.where("kind").equals("conflict").count(),
      db.conflicts.where("kind").equals("rejected").count(),
      db.blobs.count(),
      db.blobs.where("uploadState").equals("stored").count(),
      db.blobs.where("uploadState").equals("failed").count(),
      getMeta(db, "lastSyncAt"),
      getMeta(db, "lastError"),
    ]);
    const photosWaiting = blobs - blobsStored;
    return { waiting, failed, conflicts, rejected, photosWaiting, photosFailed, lastSyncAt: lastSyncAt ?? null, lastError: lastError ?? null };
  });
}

/** How many changes of this user have not reached the server (for the sign-out check). */
export async function countUnsynced(db: SyncDb): Promise<number> {
  return db.outbox.count();
}
