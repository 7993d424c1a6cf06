// Bounded thumbnails for the daily PDF. A stored photo or a drawn signature is untrusted bytes: a
// small PNG can declare 100,000 × 100,000 pixels and take every byte of memory once decoded. So the
// pixel size is read from the header first (lib/photos/image-header.ts) and anything over the limit
// is never decoded; what passes is shrunk by sharp (which enforces the same limit again) to a small
// JPEG or PNG, so the PDF never embeds a full-size image. The report also draws at most a fixed
// number of photos and says how many it left out.
import sharp from "sharp";
import { readImageHeader } from "@/lib/photos/image-header";

/** Phone photos are shrunk to a 2000 px long edge on the device; 16 MP leaves room for a camera original. */
export const MAX_PHOTO_PIXELS = 4096 * 4096;
/** A signature pad canvas is about 1000 × 300 px. */
export const MAX_SIGNATURE_PIXELS = 2048 * 1024;
/** Twelve rows of four thumbnails; further photos are listed by caption. */
export const MAX_REPORT_PHOTOS = 48;

export type Thumbnail = { ok: true; bytes: Buffer; format: "jpeg" | "png" } | { ok: false; reason: string };

export async function thumbnail(
  bytes: Uint8Array,
  opts: { maxPixels: number; widthPx: number; heightPx: number; format: "jpeg" | "png" },
): Promise<Thumbnail> {
  const header = readImageHeader(bytes);
  if (!header) return { ok: false, reason: "not a readable JPEG, PNG or WebP image" };
  if (header.widthPx * header.heightPx > opts.maxPixels) {
    return { ok: false, reason: `image of ${header.widthPx} × ${header.heightPx} px is larger than the report draws` };
  }
  try {
    const pipeline = sharp(bytes, { limitInputPixels: opts.maxPixels, failOn: "error", animated: false })
      .rotate()
      .resize(opts.widthPx, opts.heightPx, { fit: "inside", withoutEnlargement: true });
    const out = opts.format === "jpeg" ? pipeline.jpeg({ quality: 75 }) : pipeline.png();
    return { ok: true, bytes: await out.toBuffer(), format: opts.format };
  } catch {
    // A damaged image (or one whose header lied) is left out of the report rather than failing it.
    return { ok: false, reason: "the image could not be read" };
  }
}
