// The upload lane's state machine (SYNC.md "Photos"): queued → uploading → stored, or failed and
// retried with back-off. Pure: the uploader feeds it events and stores what it returns.
import type { BlobUploadState } from "@/lib/sync/client/db";

export type UploadEvent =
  | { type: "start" }
  | { type: "stored" }
  | { type: "error"; message: string; permanent?: boolean; at: number; random: number };

export type UploadFields = {
  uploadState: BlobUploadState;
  attempts: number;
  lastError?: string | null;
  nextAttemptAt?: number | null;
};

export const BACKOFF = { baseMs: 2_000, maxMs: 5 * 60_000 };

/**
 * Exponential back-off with full jitter between half and the whole delay: 2 s doubling to 5 min
 * [common practice; the same shape as the outbox's back-off in lib/sync/client/timing.ts].
 */
export function retryDelayMs(attempts: number, random: number, backoff = BACKOFF): number {
  const exp = Math.min(backoff.maxMs, backoff.baseMs * 2 ** Math.max(0, attempts - 1));
  return Math.round(exp / 2 + (exp / 2) * Math.min(1, Math.max(0, random)));
}

export class UploadTransitionError extends Error {}

/** The next state of a photo's upload; an event that makes no sense in the current state throws. */
export function nextUpload(current: UploadFields, event: UploadEvent): UploadFields {
  switch (event.type) {
    case "start":
      if (current.uploadState !== "queued" && current.uploadState !== "failed") {
        throw new UploadTransitionError(`An upload cannot start from ${current.uploadState}`);
      }
      return { uploadState: "uploading", attempts: current.attempts + 1, lastError: current.lastError ?? null, nextAttemptAt: null };
    case "stored":
      if (current.uploadState === "stored") return current;
      return { uploadState: "stored", attempts: current.attempts, lastError: null, nextAttemptAt: null };
    case "error": {
      if (current.uploadState !== "uploading") throw new UploadTransitionError(`An upload cannot fail from ${current.uploadState}`);
      return {
        uploadState: "failed",
        attempts: current.attempts,
        lastError: event.message,
        // A permanent refusal waits for a person (or a newer app); it is never retried on its own.
        nextAttemptAt: event.permanent ? null : event.at + retryDelayMs(current.attempts, event.random),
      };
    }
  }
}

/** Whether the uploader should try this photo now. A permanent failure (no next attempt) waits. */
export function isDue(row: UploadFields, now: number): boolean {
  if (row.uploadState === "queued") return true;
  if (row.uploadState === "failed") return row.nextAttemptAt != null && row.nextAttemptAt <= now;
  return false;
}

/** An "uploading" row left by a closed tab is queued again when the lane starts. */
export function recoverStale(row: UploadFields): UploadFields {
  return row.uploadState === "uploading" ? { ...row, uploadState: "queued", nextAttemptAt: null } : row;
}

/** `short` fits on a thumbnail (about 9 characters at 390 px wide, three to a row); `label` says it in full. */
export type PhotoBadge = { state: "local" | "uploading" | "stored" | "failed" | "elsewhere"; label: string; short: string; detail?: string };

/**
 * What a photo shows in the gallery, in words (the icon repeats it): from the record (storedAt) and
 * this device's blob, if any.
 */
export function photoBadge(
  record: Record<string, unknown>,
  blob: Pick<UploadFields, "uploadState" | "lastError"> | undefined,
  progress?: number,
): PhotoBadge {
  if (record.storedAt) return { state: "stored", label: "Stored", short: "Stored" };
  if (!blob) return { state: "elsewhere", label: "Uploading from another device", short: "Uploading" };
  switch (blob.uploadState) {
    case "uploading":
      return progress != null
        ? { state: "uploading", label: `Uploading ${Math.round(progress * 100)} %`, short: `${Math.round(progress * 100)} %` }
        : { state: "uploading", label: "Uploading", short: "Uploading" };
    case "failed":
      return { state: "failed", label: "Upload failed", short: "Failed", detail: blob.lastError ?? "It will try again." };
    case "stored":
      // Verified by the server; the next pull sets storedAt here.
      return { state: "stored", label: "Stored", short: "Stored" };
    default:
      return { state: "local", label: "Saved on this device", short: "On device", detail: "Uploads when there is a connection." };
  }
}
