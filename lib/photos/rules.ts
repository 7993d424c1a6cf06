// What the server accepts as a photo, and where it is stored. Pure: used by the device and the server.

export const PHOTO_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export type PhotoType = (typeof PHOTO_TYPES)[number];

/** The records a photo can belong to (record types of lib/records), and an amendment of a signed placement. */
export const ATTACHABLE = ["placements", "deliveries", "field-tests", "weather-observations", "checklist-items", "curing-readings", "diary-entries", "site-visits", "findings"] as const;
export const PHOTO_TARGETS = [...ATTACHABLE, "amendments"] as const;
export type PhotoTarget = (typeof PHOTO_TARGETS)[number];

/** Before compression on the device; after it, photos are ~1 MB. */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

const EXTENSION: Record<PhotoType, string> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp" };

/** The storage key the server generates; the device never chooses it. */
export function photoKey(projectId: string, photoId: string, contentType: PhotoType): string {
  return `projects/${projectId}/photos/${photoId}.${EXTENSION[contentType]}`;
}

/**
 * Where the verified bytes live once "complete" accepted them. The device only ever receives a
 * presigned PUT for photoKey; this key is written by the server alone, from the bytes it checked,
 * so a PUT link that is still valid cannot change a stored (or signed) photo.
 */
export function storedPhotoKey(projectId: string, photoId: string, sha256: string, contentType: PhotoType): string {
  return `projects/${projectId}/photos/${photoId}/${sha256}.${EXTENSION[contentType]}`;
}

export const TYPE_MESSAGE = "Only JPEG, PNG or WebP photos can be added. Convert the file or take the photo again.";

/** A sentence for the person, or null when the file is acceptable. */
export function photoProblem(contentType: string, sizeBytes: number): string | null {
  if (!(PHOTO_TYPES as readonly string[]).includes(contentType)) return TYPE_MESSAGE;
  if (!Number.isInteger(sizeBytes) || sizeBytes <= 0) return "The photo file is empty.";
  if (sizeBytes > MAX_PHOTO_BYTES) return `The photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`;
  return null;
}

/** The field a problem of photoProblem belongs to. */
export const photoProblemField = (contentType: string) => ((PHOTO_TYPES as readonly string[]).includes(contentType) ? "sizeBytes" : "contentType");

export const PHOTO_SIGNED_MESSAGE =
  "This placement is signed, so photos can no longer be added to it or its records. Add the photo to an amendment of the placement instead.";
