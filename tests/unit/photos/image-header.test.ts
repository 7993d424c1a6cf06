// The header reader against images written by an outside encoder (sharp/libvips, an npm reference
// library): it must name the type and the pixel size the encoder wrote, and refuse anything else.
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { readImageHeader, sniffPhotoType } from "@/lib/photos/image-header";

const make = (widthPx: number, heightPx: number) => sharp({ create: { width: widthPx, height: heightPx, channels: 3, background: "#808080" } });

describe("readImageHeader", () => {
  for (const [w, h] of [[1, 1], [640, 480], [2000, 1125], [3001, 17]] as const) {
    it(`reads ${w} × ${h} from JPEG, PNG, lossy and lossless WebP written by libvips`, async () => {
      expect(readImageHeader(await make(w, h).jpeg().toBuffer())).toEqual({ type: "image/jpeg", widthPx: w, heightPx: h });
      expect(readImageHeader(await make(w, h).jpeg({ progressive: true }).toBuffer())).toEqual({ type: "image/jpeg", widthPx: w, heightPx: h });
      expect(readImageHeader(await make(w, h).png().toBuffer())).toEqual({ type: "image/png", widthPx: w, heightPx: h });
      expect(readImageHeader(await make(w, h).webp().toBuffer())).toEqual({ type: "image/webp", widthPx: w, heightPx: h });
      expect(readImageHeader(await make(w, h).webp({ lossless: true }).toBuffer())).toEqual({ type: "image/webp", widthPx: w, heightPx: h });
    });
  }

  it("refuses what is not an accepted photo: GIF, HTML, SVG, a truncated header", async () => {
    const gif = await make(4, 4).gif().toBuffer();
    expect(sniffPhotoType(gif)).toBeNull();
    expect(sniffPhotoType(Buffer.from("<html><script>alert(1)</script>"))).toBeNull();
    expect(sniffPhotoType(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toBeNull();
    const png = await make(10, 10).png().toBuffer();
    expect(sniffPhotoType(png.subarray(0, 8))).toBe("image/png"); // the PNG signature alone
    expect(readImageHeader(png.subarray(0, 20))).toBeNull(); // but no complete IHDR
  });
});
