// Finding 8: the daily PDF decoded every stored photo whole, with no count limit. The attack: a
// member uploads a PNG whose header declares 8192 × 8192 px (268 MB once decoded) in a few hundred
// kilobytes of deflated zeros, then anyone opens the day's report. The report must refuse it from
// the header (never decode it), say so, and draw at most MAX_REPORT_PHOTOS thumbnails.
import { randomUUID } from "node:crypto";
import { deflateSync } from "node:zlib";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { inArray } from "drizzle-orm";
import { NextRequest } from "next/server";
import { PDFDocument, PDFName, PDFRawStream } from "pdf-lib";
import { extractText, getDocumentProxy } from "unpdf";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as reportRoute from "@/app/api/projects/[projectId]/reports/daily/route";
import { db } from "@/db";
import { photos } from "@/db/schema";
import { bucket, s3 } from "@/lib/photos/storage";
import { MAX_REPORT_PHOTOS } from "@/lib/reports/thumbnails";
import { projectWithTeam, sessionCookie } from "../integration/helpers";
import { makeRecord } from "../integration/record-fixtures";

const DAY = "2026-11-17"; // the test project's zone is America/Chicago: 18:00 UTC is noon that day
let s: Awaited<ReturnType<typeof projectWithTeam>>;
let placementId: string;
const made: string[] = [];

// A PNG by the PNG specification (ISO/IEC 15948): signature, IHDR, IDAT (zlib), IEND; CRC-32 per chunk.
function crc32(buf: Buffer) {
  let c = ~0;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return ~c >>> 0;
}
function chunk(type: string, data: Buffer) {
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const out = Buffer.alloc(body.length + 8);
  out.writeUInt32BE(data.length, 0);
  body.copy(out, 4);
  out.writeUInt32BE(crc32(body), body.length + 4);
  return out;
}
/** A real, valid RGBA PNG of zeros: tiny on disk, widthPx × heightPx × 4 bytes when decoded. */
function zeroPng(widthPx: number, heightPx: number) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(widthPx, 0);
  ihdr.writeUInt32BE(heightPx, 4);
  ihdr.set([8, 6, 0, 0, 0], 8); // 8-bit RGBA, deflate, adaptive filter, no interlace
  const raw = Buffer.alloc(heightPx * (1 + widthPx * 4)); // filter byte 0 + zero pixels per row
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", deflateSync(raw, { level: 9 })), chunk("IEND", Buffer.alloc(0))]);
}

async function storedPhoto(bytes: Buffer, caption: string, n: number) {
  const id = randomUUID();
  const key = `test/${id}.png`;
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: bytes, ContentType: "image/png" }));
  await db.insert(photos).values({
    id, projectId: s.project.id, changeSeq: 9_100_000_000 + n, recordType: "placements", recordId: placementId, caption,
    takenAt: new Date(`${DAY}T18:${String(n % 60).padStart(2, "0")}:00Z`), sha256: "ab".repeat(32), sizeBytes: bytes.length,
    contentType: "image/png", storageKey: key, storedAt: new Date(`${DAY}T19:00:00Z`),
  });
  made.push(id);
}

async function report() {
  const url = `/api/projects/${s.project.id}/reports/daily?date=${DAY}`;
  const req = new NextRequest(new URL(url, "http://localhost:3100"), { headers: { cookie: await sessionCookie(s.team.office) } });
  const res = await reportRoute.GET(req, { params: Promise.resolve({ projectId: s.project.id }) });
  expect(res.status).toBe(200);
  const bytes = new Uint8Array(await res.arrayBuffer());
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(bytes)), { mergePages: true });
  const images = (await PDFDocument.load(bytes)).context
    .enumerateIndirectObjects()
    .filter(([, obj]) => obj instanceof PDFRawStream && obj.dict.get(PDFName.of("Subtype")) === PDFName.of("Image"));
  return { text: text.replace(/\s+/g, " "), images: images.map(([, o]) => o as PDFRawStream) };
}

beforeAll(async () => {
  s = await projectWithTeam();
  placementId = (await makeRecord("placements", s.project.id, s.team, { plannedStart: `${DAY}T15:00:00Z` })).id;
});
afterAll(async () => {
  if (made.length) await db.delete(photos).where(inArray(photos.id, made));
});

describe("daily PDF: bounded thumbnails (finding 8)", () => {
  it("refuses a decompression-bomb PNG from its header without decoding it, and says so", async () => {
    const bomb = zeroPng(8192, 8192);
    expect(bomb.length).toBeLessThan(1_000_000); // the attack fits well under the 15 MB photo limit
    await storedPhoto(bomb, "Deck pour overview (crafted)", 0);
    const rssBefore = process.memoryUsage().rss;
    let peak = rssBefore;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
    try {
      const { text, images } = await report();
      expect(text).toContain("Deck pour overview (crafted)");
      expect(text).toContain("8192 × 8192 px is larger than the report draws");
      expect(images.length).toBe(0);
    } finally {
      clearInterval(sampler);
    }
    // Decoding it would take 8192 × 8192 × 4 bytes = 268 MB [arithmetic]; refusing it takes next to none.
    expect(peak - rssBefore).toBeLessThan(120 * 1024 * 1024);
  });

  it(`draws at most ${MAX_REPORT_PHOTOS} thumbnails, each small, and says how many it left out`, async () => {
    await db.delete(photos).where(inArray(photos.id, made.splice(0))); // the bomb of the test above
    const small = zeroPng(640, 480);
    for (let i = 1; i <= MAX_REPORT_PHOTOS + 2; i++) await storedPhoto(small, `Curing blanket ${i}`, i);
    const { text, images } = await report();
    const jpegs = images.filter((o) => o.dict.get(PDFName.of("Filter")) === PDFName.of("DCTDecode"));
    expect(jpegs.length).toBe(MAX_REPORT_PHOTOS);
    // Thumbnails, not the original: no side over 360 px (3 × the 120-point box, for print).
    for (const o of jpegs) expect(Number(String(o.dict.get(PDFName.of("Width"))))).toBeLessThanOrEqual(360);
    expect(text).toContain("2 more photos are not drawn here");
  });
});
