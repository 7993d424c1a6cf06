// What the server accepts as a photo, and where it is stored. Pure: used by the device and the server.

export const PHOTO_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export type PhotoType = (typeof PHOTO_TYPES)[number];

/** Before compression on the device; after it, photos are ~1 MB. */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

const EXTENSION: Record<PhotoType, string> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp" };

/** The storage key the server generates; the device never chooses it. */
export function photoKey(projectId: string, photoId: string, contentType: PhotoType): string {
  return `projects/${projectId}/photos/${photoId}.${EXTENSION[contentType]}`;
}

/** A sentence for the person, or null when the file is acceptable. */
export function photoProblem(contentType: string, sizeBytes: number): string | null {
  if (!(PHOTO_TYPES as readonly string[]).includes(contentType)) {
    return "Only JPEG, PNG or WebP photos can be added. Convert the file or take the photo again.";
  }
  if (!Number.isInteger(sizeBytes) || sizeBytes <= 0) return "The photo file is empty.";
  if (sizeBytes > MAX_PHOTO_BYTES) return `The photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`;
  return null;
}
