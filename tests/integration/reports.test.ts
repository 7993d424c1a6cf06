// The PDF daily report (GET /api/projects/{p}/reports/daily?date=): the PDF opens and its text,
// extracted with unpdf (pdf.js), holds the project, the date, every placement of the day and every
// warning; the references are the database rows themselves and the digest's own warning rules
// (lib/digest summarizeDay), so the report cannot drift from the e-mail. Bad dates and outsiders
// are refused.
import { randomUUID } from "node:crypto";
import { mkdirSync, writeFileSync } from "node:fs";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { and, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import { NextRequest } from "next/server";
import { PDFDict, PDFDocument, PDFName, PDFRawStream } from "pdf-lib";
import { extractText, getDocumentProxy } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { DEMO_IDS, DEMO_USERS } from "@/scripts/seed/ids";
import { seedDemo } from "@/scripts/seed/demo";
import { photos, placements, projects, signOffs } from "@/db/schema";
import { bucket, s3 } from "@/lib/photos/storage";
import * as reportRoute from "@/app/api/projects/[projectId]/reports/daily/route";
import { loadDigestDay } from "@/lib/digest/load";
import { localDayRange } from "@/lib/time/zone";
import { summarizeDay } from "@/lib/digest/summary";
import { readMaturityRecords } from "@/lib/maturity/records";
import { MATURITY_CAUTIONS, buildMaturityView, estimateText, targetText } from "@/lib/maturity/view";
import { callRoute, createUser, sessionCookie, type TestUser } from "./helpers";

const LARKSPUR = DEMO_IDS.projects.larkspur;
const DAY = "2026-11-17"; // the demo's hot, windy afternoon: a slump out of tolerance, a rejected load
const office = DEMO_USERS.find((u) => u.email === "olu.office@example.test")! as TestUser;
const owner = DEMO_USERS.find((u) => u.email === "oona.owner@example.test")! as TestUser;

async function getReport(user: TestUser, date: string, projectId = LARKSPUR): Promise<Response> {
  const req = new NextRequest(new URL(`/api/projects/${projectId}/reports/daily?date=${encodeURIComponent(date)}`, "http://localhost:3100"), {
    headers: { cookie: await sessionCookie(user) },
  });
  return reportRoute.GET(req, { params: Promise.resolve({ projectId }) });
}

/** The PDF's text, every run of white space made one space (a wrapped line reads as one). */
async function pdfText(bytes: Uint8Array): Promise<{ text: string; pages: number }> {
  const pdf = await getDocumentProxy(new Uint8Array(bytes));
  const { text, totalPages } = await extractText(pdf, { mergePages: true });
  return { text: text.replace(/\s+/g, " "), pages: totalPages };
}
// A 1 × 1 PNG (a valid image by the PNG specification: IHDR, IDAT, IEND).
const PNG_1X1 = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=";
const flat = (s: string) => s.replace(/\s+/g, " ").trim();

beforeAll(async () => {
  await seedDemo(db);
});

describe("PDF daily report", () => {
  it("holds the project, the date, every placement of the day and every warning", async () => {
    const res = await getReport(office, DAY);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(/daily-report-.*2026-11-17\.pdf/);
    const bytes = new Uint8Array(await res.arrayBuffer());
    mkdirSync(".data", { recursive: true });
    writeFileSync(".data/report-test.pdf", bytes); // for pdftoppm and a look

    // The PDF opens (pdf-lib parses it back) and embeds our own fonts, not a standard 14 font.
    const parsed = await PDFDocument.load(bytes);
    expect(parsed.getPageCount()).toBeGreaterThan(0);
    // Each font descriptor carries an embedded font program (FontFile2/FontFile3, PDF 32000-1 §9.9) of IBM Plex Mono.
    const descriptors = parsed.context
      .enumerateIndirectObjects()
      .map(([, obj]) => obj)
      .filter((obj): obj is PDFDict => obj instanceof PDFDict && obj.get(PDFName.of("Type")) === PDFName.of("FontDescriptor"));
    expect(descriptors.length).toBe(2); // regular and semibold
    for (const d of descriptors) {
      expect(d.get(PDFName.of("FontFile2")) ?? d.get(PDFName.of("FontFile3"))).toBeDefined();
      expect(String(d.get(PDFName.of("FontName")))).toMatch(/IBMPlexMono/);
    }

    const { text } = await pdfText(bytes);
    const [project] = await db.select().from(projects).where(eq(projects.id, LARKSPUR));
    expect(text).toContain(project.name);
    expect(text).toContain(DAY);
    expect(text).toContain("Tuesday, November 17, 2026"); // 2026-11-17 is a Tuesday [calendar]

    // Every placement planned on the project-local day, straight from the table.
    const range = localDayRange(DAY, project.timeZone);
    const rows = await db
      .select({ element: placements.element })
      .from(placements)
      .where(and(eq(placements.projectId, LARKSPUR), isNull(placements.deletedAt), gte(placements.plannedStart, range.start), lt(placements.plannedStart, range.end)));
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(text).toContain(flat(r.element));

    // Every warning the digest's rules raise for the day, by its title.
    const warnings = summarizeDay(await loadDigestDay(LARKSPUR, DAY)).warnings;
    expect(warnings.length).toBeGreaterThan(0);
    expect(text).toContain(`Warnings (${warnings.length})`);
    for (const w of warnings) expect(text).toContain(flat(w.title));
  });

  it("lists a signature with the signer's typed name and draws the signature image", async () => {
    const [placement] = await db
      .select({ id: placements.id })
      .from(placements)
      .where(and(eq(placements.projectId, LARKSPUR), isNull(placements.deletedAt), gte(placements.plannedStart, new Date("2026-11-17T06:00:00Z")), lt(placements.plannedStart, new Date("2026-11-18T06:00:00Z"))));
    const id = randomUUID();
    const png = PNG_1X1; // the drawn signature
    await db.insert(signOffs).values({
      id, projectId: LARKSPUR, changeSeq: 9_000_000_000, recordType: "placements", recordId: placement.id, signerId: office.id, role: "office",
      signedAt: new Date("2026-11-17T23:10:00Z"), typedName: "Olu Adeyemi (report test)", signatureImage: png, contentHash: "ab".repeat(32),
    });
    try {
      const bytes = new Uint8Array(await (await getReport(office, DAY)).arrayBuffer());
      const { text } = await pdfText(bytes);
      expect(text).toContain("Olu Adeyemi (report test)");
      expect(text).toContain("Signed Nov 17, 2026, 5:10 PM"); // 23:10 UTC is 17:10 CST (UTC-6) in Chicago [IANA tz]
      const images = (await PDFDocument.load(bytes)).context
        .enumerateIndirectObjects()
        .filter(([, obj]) => obj instanceof PDFRawStream && obj.dict.get(PDFName.of("Subtype")) === PDFName.of("Image"));
      // pdf-lib stores a PNG's alpha as a second image, the first one's /SMask (PDF 32000-1 §11.6.5.3).
      const masks = new Set(images.map(([, obj]) => String((obj as PDFRawStream).dict.get(PDFName.of("SMask")))).filter((r) => r !== "undefined"));
      expect(images.filter(([ref]) => !masks.has(String(ref))).length).toBe(1);
    } finally {
      // sign_offs is append-only (drizzle/0011); the test's own row is removed as the owner would.
      await db.transaction(async (tx) => {
        await tx.execute(sql`set local session_replication_role = replica`);
        await tx.delete(signOffs).where(eq(signOffs.id, id));
      });
    }
  });

  it("draws a thumbnail of a stored photo and lists one whose bytes are gone without failing", async () => {
    const [placement] = await db
      .select({ id: placements.id })
      .from(placements)
      .where(and(eq(placements.projectId, LARKSPUR), isNull(placements.deletedAt), gte(placements.plannedStart, new Date("2026-11-17T06:00:00Z")), lt(placements.plannedStart, new Date("2026-11-18T06:00:00Z"))));
    const png = Buffer.from(PNG_1X1.split(",")[1], "base64");
    const stored = randomUUID();
    const gone = randomUUID();
    const key = `test/${stored}.png`;
    await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: png, ContentType: "image/png" }));
    const photo = (id: string, storageKey: string, caption: string, n: number) => ({
      id, projectId: LARKSPUR, changeSeq: 9_000_000_100 + n, recordType: "placements", recordId: placement.id, caption,
      takenAt: new Date("2026-11-17T21:00:00Z"), sha256: "cd".repeat(32), sizeBytes: png.length, contentType: "image/png", storageKey, storedAt: new Date("2026-11-17T21:05:00Z"),
    });
    await db.insert(photos).values([photo(stored, key, "Fogging at the deck edge (report test)", 1), photo(gone, `test/${gone}.png`, "Lost bytes (report test)", 2)]);
    try {
      const res = await getReport(office, DAY);
      expect(res.status).toBe(200);
      const bytes = new Uint8Array(await res.arrayBuffer());
      writeFileSync(".data/report-photos.pdf", bytes); // for a look at the thumbnails
      const { text } = await pdfText(bytes);
      expect(text).toContain("Photos (2)");
      expect(text).toContain("Fogging at the deck edge");
      expect(text).toContain("Lost bytes (report test) (3:00 PM) (no thumbnail");
      const images = (await PDFDocument.load(bytes)).context
        .enumerateIndirectObjects()
        .filter(([, obj]) => obj instanceof PDFRawStream && obj.dict.get(PDFName.of("Subtype")) === PDFName.of("Image"));
      const masks = new Set(images.map(([, obj]) => String((obj as PDFRawStream).dict.get(PDFName.of("SMask")))).filter((r) => r !== "undefined"));
      expect(images.filter(([ref]) => !masks.has(String(ref))).length).toBe(1); // the stored one only
    } finally {
      await db.delete(photos).where(inArray(photos.id, [stored, gone]));
    }
  });

  it("says so on a day with nothing recorded, for any member (the owner too)", async () => {
    const res = await getReport(owner, "2026-03-02");
    expect(res.status).toBe(200);
    const { text } = await pdfText(new Uint8Array(await res.arrayBuffer()));
    expect(text).toContain("Nothing was recorded for this project on this date.");
    expect(text).toContain("No diary was written for this date.");
    expect(text).toContain("Warnings (0)");
  });

  it("refuses a bad or missing date with a clear message", async () => {
    for (const bad of ["2026-02-30", "17/11/2026", "", "2026-11-17T00:00"]) {
      const r = await callRoute(reportRoute.GET, { user: office, url: `/api/projects/${LARKSPUR}/reports/daily?date=${encodeURIComponent(bad)}`, params: { projectId: LARKSPUR } });
      expect(r.status, bad).toBe(400);
      expect(r.json.error.code).toBe("invalid_input");
      expect(r.json.error.message).toMatch(/date/i);
    }
    const missing = await callRoute(reportRoute.GET, { user: office, url: `/api/projects/${LARKSPUR}/reports/daily`, params: { projectId: LARKSPUR } });
    expect(missing.status).toBe(400);
    expect(missing.json.error.message).toMatch(/2026-11-17/);
  });

  it("refuses a user who is not a member, and a signed-out caller", async () => {
    const outsider = await createUser();
    const r = await callRoute(reportRoute.GET, { user: outsider, url: `/api/projects/${LARKSPUR}/reports/daily?date=${DAY}`, params: { projectId: LARKSPUR } });
    expect(r.status).toBe(404);
    expect(r.json.error.message).toBe("Project not found.");
    const anon = await callRoute(reportRoute.GET, { user: null, url: `/api/projects/${LARKSPUR}/reports/daily?date=${DAY}`, params: { projectId: LARKSPUR } });
    expect(anon.status).toBe(401);
    const notUuid = await callRoute(reportRoute.GET, { user: office, url: `/api/projects/nope/reports/daily?date=${DAY}`, params: { projectId: "nope" } });
    expect(notUuid.status).toBe(400);
  });
});

describe("PDF daily report: in-place strength by the maturity method", () => {
  const MATURITY_DAY = "2026-11-19"; // the demo deck's third day of logging

  it("shows each sensor's maturity at the end of the day, the same estimate as the office page, and the C1074 cautions", async () => {
    const res = await getReport(office, MATURITY_DAY);
    expect(res.status).toBe(200);
    const { text } = await pdfText(new Uint8Array(await res.arrayBuffer()));
    expect(text).toContain("In-place strength by the maturity method (1)");
    expect(text).toContain("Level 2 deck");

    const { end } = localDayRange(MATURITY_DAY, "America/Chicago");
    const [deck] = await db.select().from(placements).where(and(eq(placements.projectId, LARKSPUR), eq(placements.element, "Level 2 deck")));
    const records = await readMaturityRecords(db, LARKSPUR, deck.id, deck.mixId, end);
    // ASTM C1074 temperature-time factor, summed here independently of lib/concrete: each interval
    // at the mean of its two readings, datum 0 °C (the standard's default), in °C·h.
    for (const sensor of records.sensors) {
      const readings = records.batches.filter((b) => b.sensorId === sensor.id).flatMap((b) => b.readings).sort((a, b) => a[0].localeCompare(b[0]));
      let factor = 0;
      for (let i = 1; i < readings.length; i++) {
        const hours = (Date.parse(readings[i][0]) - Date.parse(readings[i - 1][0])) / 3_600_000;
        factor += Math.max(0, (readings[i][1] + readings[i - 1][1]) / 2) * hours;
      }
      expect(readings.length).toBeGreaterThan(10);
      expect(text).toContain(`${sensor.name} ${sensor.location} ${readings.length}`);
      expect(text).toContain(`${Math.round(factor)}`);
    }

    // The office page's view of the same records at the same instant says the same.
    const [project] = await db.select().from(projects).where(eq(projects.id, LARKSPUR));
    const view = buildMaturityView({
      project,
      placement: { ...deck, plannedStart: deck.plannedStart.toISOString() },
      mixCode: "LC-5000-D",
      ...records,
      targetMPa: project.maturityTargetMPa,
      now: end,
    });
    expect(text).toContain(flat(`Estimated in-place strength at 2026-11-20 00:00: ${estimateText(view, "IP")}`));
    expect(text).toContain(flat(`Target: ${targetText(view, "America/Chicago")}`));
    for (const caution of MATURITY_CAUTIONS) expect(text).toContain(flat(caution));
  });

  it("leaves the section out on a day without a temperature record", async () => {
    const { text } = await pdfText(new Uint8Array(await (await getReport(office, "2026-11-10")).arrayBuffer()));
    expect(text).not.toContain("maturity method");
  });
});
