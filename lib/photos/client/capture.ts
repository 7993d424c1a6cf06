// From a camera or gallery file to a photo on the device: check, compress (EXIF orientation applied,
// metadata dropped by re-encoding through a canvas), thumbnail, SHA-256; then the blobs and the
// photo's metadata mutation in ONE Dexie transaction (SYNC.md "Write rule").
import type { SyncDb, BlobRow } from "@/lib/sync/client/db";
import { createLocal, newRecordId, type WriteResult } from "@/lib/sync/client/mutate";
import type { PhotoTarget } from "../rules";
import { COMPRESSED, decodeProblem, inputProblem, inputType, photoFileName, THUMBNAIL, toHex } from "./rules";

export class PhotoInputError extends Error {}

export type PreparedPhoto = { full: Blob; thumb: Blob; sha256: string; contentType: "image/jpeg"; sizeBytes: number };

export async function sha256Hex(blob: Blob): Promise<string> {
  return toHex(await crypto.subtle.digest("SHA-256", await blob.arrayBuffer()));
}

/** Compresses a photo in the browser; throws PhotoInputError with a sentence for the person. */
export async function preparePhoto(file: File, onProgress?: (percent: number) => void): Promise<PreparedPhoto> {
  const problem = inputProblem(file);
  if (problem) throw new PhotoInputError(problem);
  const { default: imageCompression } = await import("browser-image-compression");
  let full: File;
  let thumb: File;
  try {
    // No web worker: the library would fetch its worker script from a CDN, which is not there offline.
    // Location and the other metadata are not kept (preserveExif false; there is no project opt-in).
    full = await imageCompression(file, { ...COMPRESSED, useWebWorker: false, preserveExif: false, initialQuality: 0.85, onProgress });
    thumb = await imageCompression(full, { ...THUMBNAIL, useWebWorker: false, preserveExif: false, initialQuality: 0.8 });
  } catch (error) {
    console.warn("photos: compression failed", error);
    throw new PhotoInputError(decodeProblem(inputType(file)));
  }
  if (full.type !== "image/jpeg") throw new PhotoInputError(decodeProblem(inputType(file)));
  return { full, thumb, sha256: await sha256Hex(full), contentType: "image/jpeg", sizeBytes: full.size };
}

export type PhotoMeta = {
  projectId: string;
  recordType: PhotoTarget;
  recordId: string;
  caption?: string;
  takenAt?: string | null;
  id?: string;
};

/**
 * Keeps the photo on this device and queues its metadata for sync, both or neither: the blob row
 * and the record + outbox entry are written in one transaction.
 */
export async function savePhoto(db: SyncDb, meta: PhotoMeta, photo: PreparedPhoto, now = new Date()): Promise<WriteResult> {
  const id = meta.id ?? newRecordId();
  const blob: BlobRow = {
    id,
    projectId: meta.projectId,
    recordId: meta.recordId,
    data: new File([photo.full], photoFileName(id), { type: photo.contentType }),
    thumb: photo.thumb,
    sha256: photo.sha256,
    contentType: photo.contentType,
    size: photo.sizeBytes,
    uploadState: "queued",
    attempts: 0,
    lastError: null,
    nextAttemptAt: null,
    createdAt: now.toISOString(),
  };
  return db.transaction("rw", [...db.syncTables(), db.blobs], async () => {
    await db.blobs.add(blob);
    return createLocal(db, "photos", meta.projectId, {
      id,
      recordType: meta.recordType,
      recordId: meta.recordId,
      caption: meta.caption ?? "",
      takenAt: meta.takenAt ?? null,
      sha256: photo.sha256,
      sizeBytes: photo.sizeBytes,
      contentType: photo.contentType,
    });
  });
}
