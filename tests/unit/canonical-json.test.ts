import { createHash } from "node:crypto";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { canonicalJson, sha256Hex } from "@/lib/signoff/canonical";

describe("canonical JSON and hash of a signed record", () => {
  it("sorts keys at every depth and writes dates as ISO 8601 UTC", () => {
    const text = canonicalJson({ b: 1, a: { d: new Date("2026-11-16T14:05:00-06:00"), c: [3, { z: 1, y: 2 }] }, u: undefined });
    expect(text).toBe('{"a":{"c":[3,{"y":2,"z":1}],"d":"2026-11-16T20:05:00.000Z"},"b":1}');
  });

  it("keeps units in the field names and numbers exact", () => {
    expect(canonicalJson({ volumeM3: 7.65, slumpMm: 100 })).toBe('{"slumpMm":100,"volumeM3":7.65}');
  });

  it("gives the same text whatever the key order (property)", () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.oneof(fc.integer(), fc.string(), fc.boolean(), fc.constant(null))), (obj) => {
        const reversed = Object.fromEntries(Object.entries(obj).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(obj));
      }),
    );
  });

  it("hashes with SHA-256 (checked against node:crypto and the published empty-string digest)", () => {
    // FIPS 180-4 test vector: SHA-256("") = e3b0c442…b855; SHA-256("abc") = ba7816bf…15ad.
    expect(sha256Hex("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    const text = canonicalJson({ a: 1 });
    expect(sha256Hex(text)).toBe(createHash("sha256").update(text).digest("hex"));
  });

  it("a changed value changes the hash", () => {
    expect(sha256Hex(canonicalJson({ slumpMm: 100 }))).not.toBe(sha256Hex(canonicalJson({ slumpMm: 101 })));
  });
});
