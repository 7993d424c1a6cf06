import { describe, expect, it } from "vitest";
import { MAX_PHOTO_BYTES, photoKey, photoProblem } from "@/lib/photos/rules";

describe("photo rules", () => {
  it("the server generates the key from project and photo ids, with the type's extension", () => {
    expect(photoKey("p1", "f1", "image/jpeg")).toBe("projects/p1/photos/f1.jpg");
    expect(photoKey("p1", "f1", "image/webp")).toBe("projects/p1/photos/f1.webp");
  });

  it("accepts JPEG, PNG and WebP up to 15 MB", () => {
    expect(photoProblem("image/jpeg", 1)).toBeNull();
    expect(photoProblem("image/png", MAX_PHOTO_BYTES)).toBeNull();
    expect(photoProblem("image/webp", 900_000)).toBeNull();
  });

  it("refuses other types, empty and oversize files with a plain message", () => {
    expect(photoProblem("application/pdf", 1000)).toMatch(/Only JPEG, PNG or WebP/);
    expect(photoProblem("image/gif", 1000)).toMatch(/Only JPEG, PNG or WebP/);
    expect(photoProblem("image/jpeg", 0)).toMatch(/empty/);
    expect(photoProblem("image/jpeg", MAX_PHOTO_BYTES + 1)).toMatch(/larger than 15 MB/);
  });
});
