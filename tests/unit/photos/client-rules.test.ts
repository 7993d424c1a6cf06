import { describe, expect, it } from "vitest";
import { MAX_PHOTO_BYTES } from "@/lib/photos/rules";
import { formatBytes, INPUT_ACCEPT, inputProblem, inputType, photoFileName, toHex } from "@/lib/photos/client/rules";

describe("what the device accepts before compression (issue 6: JPEG, PNG, WebP, HEIC; ≤ 15 MB)", () => {
  it("offers exactly these types to the camera and gallery input", () => {
    expect(INPUT_ACCEPT).toBe("image/jpeg,image/png,image/webp,image/heic,image/heif");
  });

  it("accepts the four kinds up to 15 MB, judging an untyped file by its extension", () => {
    expect(inputProblem({ type: "image/jpeg", name: "a.jpg", size: 5 * 1024 * 1024 })).toBeNull();
    expect(inputProblem({ type: "image/png", name: "a.png", size: MAX_PHOTO_BYTES })).toBeNull();
    expect(inputProblem({ type: "image/webp", name: "a.webp", size: 1 })).toBeNull();
    expect(inputProblem({ type: "", name: "IMG_0042.HEIC", size: 3_000_000 })).toBeNull();
    expect(inputType({ type: "", name: "IMG_0042.HEIC" })).toBe("image/heic");
    expect(inputType({ type: "IMAGE/JPEG", name: "x" })).toBe("image/jpeg");
  });

  it("refuses other types, empty and oversize files, saying why in words", () => {
    expect(inputProblem({ type: "image/gif", name: "a.gif", size: 1000 })).toMatch(/Choose a JPEG, PNG, WebP or HEIC photo/);
    expect(inputProblem({ type: "application/pdf", name: "ticket.pdf", size: 1000 })).toMatch(/not a photo/);
    expect(inputProblem({ type: "", name: "notes", size: 1000 })).toMatch(/not a photo/);
    expect(inputProblem({ type: "image/jpeg", name: "a.jpg", size: 0 })).toMatch(/empty/);
    // 15 MB is 15 × 1024 × 1024 bytes; one byte more is refused, with the file's own size shown.
    expect(inputProblem({ type: "image/jpeg", name: "a.jpg", size: MAX_PHOTO_BYTES + 1 })).toMatch(/is 15\.0 MB; photos can be at most 15 MB/);
    expect(inputProblem({ type: "image/jpeg", name: "a.jpg", size: 20 * 1024 * 1024 })).toMatch(/is 20\.0 MB/);
  });

  it("names the compressed file by the photo id, and hex-encodes digests", () => {
    expect(photoFileName("5e0c2b9a-1f0e-4a8e-9a55-0000000000aa")).toBe("5e0c2b9a-1f0e-4a8e-9a55-0000000000aa.jpg");
    expect(toHex(new Uint8Array([0, 15, 255]).buffer)).toBe("000fff");
    expect(formatBytes(1_048_576)).toBe("1.0 MB");
    expect(formatBytes(640 * 1024)).toBe("640 kB");
  });

  it("SHA-256 through crypto.subtle matches the published test vector for \"abc\" (FIPS 180-2, appendix B.1)", async () => {
    const digest = await crypto.subtle.digest("SHA-256", new TextEncoder().encode("abc"));
    expect(toHex(digest)).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});
