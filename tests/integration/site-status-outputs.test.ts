// The owner's and the office's outputs carry what stands on the site (issue 17 item 7): a hold and
// its reason, a site visit's open finding with its severity, and the diary's safety notes. The
// e-mail is read back with mailparser (the MIME message nodemailer composes) and the PDF with unpdf
// (pdf.js); the references are the demo's rows and the finding written here.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { simpleParser } from "mailparser";
import { NextRequest } from "next/server";
import nodemailer from "nodemailer";
import { extractText, getDocumentProxy } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { seedDemo } from "@/scripts/seed/demo";
import { DEMO_IDS, DEMO_USERS } from "@/scripts/seed/ids";
import { placements, sentDigests } from "@/db/schema";
import * as reportRoute from "@/app/api/projects/[projectId]/reports/daily/route";
import { sendDigest, type MailTransport } from "@/lib/digest/send";
import { createRecord } from "@/lib/records/write";
import { sessionCookie, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

const LARKSPUR = DEMO_IDS.projects.larkspur;
const DAY = "2026-11-10"; // the demo diary's safety note: "Toolbox talk on working near the pump boom."
const SAFETY = "Toolbox talk on working near the pump boom.";
const office = DEMO_USERS.find((u) => u.email === "olu.office@example.test")! as TestUser;
const inspector = DEMO_USERS.find((u) => u.email === "ines.inspect@example.test")! as TestUser;
const tag = randomUUID().slice(0, 8);
const FINDING = `Bottom bar cover 25 mm at the SW-3 sump (${tag})`;
let holdReason = "";

beforeAll(async () => {
  await seedDemo(db);
  await db.delete(sentDigests).where(and(eq(sentDigests.projectId, LARKSPUR), eq(sentDigests.date, DAY)));
  const [held] = await db.select().from(placements).where(and(eq(placements.projectId, LARKSPUR), eq(placements.state, "held")));
  holdReason = held.holdReason!;
  const visit: Record<string, unknown> = { ...validBody("site-visits"), visitDate: DAY };
  await createRecord({ user: inspector }, "site-visits", LARKSPUR, visit);
  await createRecord({ user: inspector }, "findings", LARKSPUR, { ...validBody("findings", visit.id as string), description: FINDING, severity: "major" });
}, 120_000);

const flat = (s: string) => s.replace(/\s+/g, " ");

describe("a day with a hold, an open finding and a safety note", () => {
  it("the digest e-mail, parsed with mailparser, names all three in its HTML and text parts", async () => {
    const stream = nodemailer.createTransport({ streamTransport: true, buffer: true });
    const raw: Buffer[] = [];
    const transport: MailTransport = {
      async sendMail(mail) {
        const info = await stream.sendMail(mail);
        raw.push(info.message as Buffer);
        return info;
      },
    };
    const report = await sendDigest(LARKSPUR, DAY, { transport, origin: "https://placewright.example.test" });
    expect(report.sent.length).toBeGreaterThan(0);
    const mail = await simpleParser(raw[0]);
    const text = flat(mail.text ?? "");
    const html = flat(String(mail.html));
    expect(text).toMatch(/HELD \(\d+\)/);
    expect(text).toContain(flat(holdReason));
    expect(text).toContain(`Major, open: ${FINDING}`);
    expect(text).toContain(`SAFETY NOTES ${SAFETY}`);
    expect(html).toContain(flat(holdReason).replace(/&/g, "&amp;"));
    expect(html).toMatch(/Open findings of site visits \(\d+\)/);
    expect(html).toContain(FINDING);
    expect(html).toContain("Safety notes");
    expect(html).toContain(SAFETY);
  });

  it("the PDF daily report, read with unpdf, names all three", async () => {
    const req = new NextRequest(new URL(`/api/projects/${LARKSPUR}/reports/daily?date=${DAY}`, "http://localhost:3100"), { headers: { cookie: await sessionCookie(office) } });
    const res = await reportRoute.GET(req, { params: Promise.resolve({ projectId: LARKSPUR }) });
    expect(res.status).toBe(200);
    const pdf = await getDocumentProxy(new Uint8Array(await res.arrayBuffer()));
    const text = flat((await extractText(pdf, { mergePages: true })).text);
    expect(text).toMatch(/Held \(\d+\)/);
    expect(text).toContain(flat(holdReason).slice(0, 60));
    expect(text).toMatch(/Open findings of site visits \(\d+\)/);
    expect(text).toContain(FINDING.slice(0, 40));
    expect(text).toContain("Major, open");
    expect(text).toContain(SAFETY);
  });
});
