// What a file says it is, read from its first bytes only: the magic number of each photo type the
// app accepts (lib/photos/rules.ts PHOTO_TYPES) and the pixel size from the header, so a file can be
// refused before anything decodes it. Pure: no image library is called here.
import type { PhotoType } from "./rules";

export type ImageHeader = { type: PhotoType; widthPx: number; heightPx: number };

const PNG_MAGIC = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]; // PNG spec 5.2 signature
const startsWith = (b: Uint8Array, magic: number[], at = 0) => magic.every((v, i) => b[at + i] === v);
const ascii = (b: Uint8Array, at: number, n: number) => String.fromCharCode(...b.subarray(at, at + n));

/** The type named by the file's magic bytes, or null when it is none of the accepted ones. */
export function sniffPhotoType(b: Uint8Array): PhotoType | null {
  if (startsWith(b, PNG_MAGIC)) return "image/png";
  if (startsWith(b, [0xff, 0xd8, 0xff])) return "image/jpeg"; // JPEG SOI marker + the next marker's 0xFF
  if (b.length >= 12 && ascii(b, 0, 4) === "RIFF" && ascii(b, 8, 4) === "WEBP") return "image/webp";
  return null;
}

function be16(b: Uint8Array, at: number) {
  return (b[at] << 8) | b[at + 1];
}
function le16(b: Uint8Array, at: number) {
  return b[at] | (b[at + 1] << 8);
}
function le24(b: Uint8Array, at: number) {
  return b[at] | (b[at + 1] << 8) | (b[at + 2] << 16);
}
function be32(b: Uint8Array, at: number) {
  return ((b[at] << 24) >>> 0) + ((b[at + 1] << 16) | (b[at + 2] << 8) | b[at + 3]);
}

// JPEG: walk the marker segments to the first start-of-frame (SOF0–SOF15 except DHT C4, JPG C8, DAC CC).
function jpegSize(b: Uint8Array): [number, number] | null {
  let at = 2;
  while (at + 9 < b.length) {
    if (b[at] !== 0xff) return null;
    const marker = b[at + 1];
    if (marker === 0xff) {
      at += 1; // fill byte
      continue;
    }
    const length = be16(b, at + 2);
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return [be16(b, at + 7), be16(b, at + 5)];
    }
    if (length < 2) return null;
    at += 2 + length;
  }
  return null;
}

// WebP container (RIFF): VP8 (lossy), VP8L (lossless) or VP8X (extended) first chunk.
function webpSize(b: Uint8Array): [number, number] | null {
  if (b.length < 30) return null;
  const chunk = ascii(b, 12, 4);
  if (chunk === "VP8 ") return [le16(b, 26) & 0x3fff, le16(b, 28) & 0x3fff];
  if (chunk === "VP8L") {
    const bits = b[21] | (b[22] << 8) | (b[23] << 16) | (b[24] << 24);
    return [(bits & 0x3fff) + 1, ((bits >>> 14) & 0x3fff) + 1];
  }
  if (chunk === "VP8X") return [le24(b, 24) + 1, le24(b, 27) + 1];
  return null;
}

/** Type and pixel size from the header, or null when the bytes are not a readable JPEG, PNG or WebP. */
export function readImageHeader(b: Uint8Array): ImageHeader | null {
  const type = sniffPhotoType(b);
  let size: [number, number] | null = null;
  // PNG: the IHDR chunk comes first, width and height as 4-byte big-endian (PNG spec 11.2.2).
  if (type === "image/png") size = b.length >= 24 && ascii(b, 12, 4) === "IHDR" ? [be32(b, 16), be32(b, 20)] : null;
  if (type === "image/jpeg") size = jpegSize(b);
  if (type === "image/webp") size = webpSize(b);
  if (!type || !size || size[0] <= 0 || size[1] <= 0) return null;
  return { type, widthPx: size[0], heightPx: size[1] };
}
