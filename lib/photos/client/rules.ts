// What the device accepts from the camera or the gallery, and how it names what it keeps. Pure.
import { MAX_PHOTO_BYTES } from "../rules";

/** What the file input offers: the server's types plus HEIC/HEIF, which the browser converts if it can. */
export const INPUT_TYPES = ["image/jpeg", "image/png", "image/webp", "image/heic", "image/heif"] as const;
export const INPUT_ACCEPT = INPUT_TYPES.join(",");

const EXTENSIONS: Record<string, (typeof INPUT_TYPES)[number]> = {
  jpg: "image/jpeg",
  jpeg: "image/jpeg",
  png: "image/png",
  webp: "image/webp",
  heic: "image/heic",
  heif: "image/heif",
};

/** Compression targets (issue 6): long edge 2000 px, ≤ 1 MB, always JPEG; a ~320 px thumbnail. */
export const COMPRESSED = { maxWidthOrHeight: 2000, maxSizeMB: 1, fileType: "image/jpeg" } as const;
export const THUMBNAIL = { maxWidthOrHeight: 320, maxSizeMB: 0.05, fileType: "image/jpeg" } as const;

/** The file's type as the browser says it, or from its extension (some phones leave HEIC untyped). */
export function inputType(file: { type: string; name: string }): string {
  if (file.type) return file.type.toLowerCase();
  const ext = file.name.split(".").pop()?.toLowerCase() ?? "";
  return EXTENSIONS[ext] ?? "";
}

export const isHeic = (type: string) => type === "image/heic" || type === "image/heif";

/** A sentence for the person before anything is compressed or stored, or null when the file is acceptable. */
export function inputProblem(file: { type: string; name: string; size: number }): string | null {
  const type = inputType(file);
  if (!(INPUT_TYPES as readonly string[]).includes(type)) {
    return "This file is not a photo Placewright can take. Choose a JPEG, PNG, WebP or HEIC photo.";
  }
  if (file.size <= 0) return "The photo file is empty. Take the photo again.";
  if (file.size > MAX_PHOTO_BYTES) {
    const mb = (file.size / 1024 / 1024).toFixed(1);
    return `The photo is ${mb} MB; photos can be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB before compression. Take it at a lower resolution or choose a smaller one.`;
  }
  return null;
}

/** When decoding fails (typically HEIC outside Safari): what to do instead. */
export function decodeProblem(type: string): string {
  return isHeic(type)
    ? "This phone's browser cannot read HEIC photos. Set the camera to \u201cMost compatible\u201d (JPEG), or take the photo with the Camera button here."
    : "The photo could not be read. It may be damaged; take it again.";
}

/** The name of the compressed file (the server makes the storage key; this is only for the device). */
export const photoFileName = (photoId: string) => `${photoId}.jpg`;

/** Hex of a SHA-256 digest (crypto.subtle gives an ArrayBuffer). */
export function toHex(digest: ArrayBuffer): string {
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
}

/** "1.2 MB", "640 kB" for the person. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} kB`;
}
