// The owner's daily digest end to end: the job for the demo project and a demo day sends one
// e-mail per recipient through the local SMTP fake; the mail is parsed back with mailparser; a
// rerun sends nothing; an SMTP failure is retried by the queue; unsubscribe links are signed.
import { readFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { and, eq, like, sql } from "drizzle-orm";
import { simpleParser, type ParsedMail } from "mailparser";
import { NextRequest } from "next/server";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { DEMO_IDS, DEMO_USERS } from "@/scripts/seed/ids";
import { seedDemo } from "@/scripts/seed/demo";
import { digestRecipients, sentDigests } from "@/db/schema";
import * as preview from "@/app/api/projects/[projectId]/digest/preview/route";
import * as recipientsRoute from "@/app/api/projects/[projectId]/digest/recipients/route";
import * as recipientRoute from "@/app/api/projects/[projectId]/digest/recipients/[recipientId]/route";
import * as sendRoute from "@/app/api/projects/[projectId]/digest/send/route";
import * as unsubscribeRoute from "@/app/api/digest/unsubscribe/route";
import { DIGEST_QUEUE, enqueueDigest, getBoss, scheduleNext, singletonKey, stopQueue } from "@/lib/digest/queue";
import { accessTo } from "@/lib/auth/access";
import { activeRecipients, updateRecipient } from "@/lib/digest/recipients";
import { nextSendTime } from "@/lib/digest/schedule";
import { startDigestWorker, runDigestJob } from "@/lib/digest/worker";
import { callRoute, projectWithTeam, sessionCookie, type TestUser } from "./helpers";

const LARKSPUR = DEMO_IDS.projects.larkspur;
const DAY = "2026-11-17"; // the hot, windy afternoon: level 2 deck, a slump out of tolerance, a rejected load
const NEXT_ACTIVE_DAY = "2026-11-19"; // the held shear walls and a diary
const MAILBOX = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";
const MAIL_DIR = path.join(process.env.FAKES_DIR ?? path.join(process.env.PLACEWRIGHT_DATA_DIR ?? ".data", "test-run"), "mail");
const office = DEMO_USERS.find((u) => u.email === "olu.office@example.test")! as TestUser;
const owner = DEMO_USERS.find((u) => u.email === "oona.owner@example.test")! as TestUser;
const tag = randomUUID().slice(0, 8);
const added = `digest-${tag}@example.test`;
const testProjects: string[] = [];

type Stored = { id: string; receivedAt: string; to: string[]; subject: string; text: string; html: string };

/** Messages to one address received since `since` whose subject mentions `about`: other tests' mail is left alone. */
async function mailTo(email: string, since: Date, about: string): Promise<Stored[]> {
  const res = await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(email)}`);
  const all = (await res.json()) as Stored[];
  return all.filter((m) => new Date(m.receivedAt) >= since && m.subject.includes(about));
}

async function waitForMail(email: string, since: Date, about: string, timeoutMs = 20_000): Promise<Stored[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await mailTo(email, since, about);
    if (found.length || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
}

const raw = (m: Stored): Promise<ParsedMail> => simpleParser(readFileSync(path.join(MAIL_DIR, `${m.id}.eml`)));

/** A transport to a port nothing listens on: the first attempt of a send fails like an SMTP outage. */
async function closedPortTransport() {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true, connectionTimeout: 2_000 });
}

async function waitingJobs(projectId: string) {
  const result = await db.execute(sql`select id::text as id, singleton_key, start_after from pgboss.job
    where name = ${DIGEST_QUEUE} and state = 'created' and data->>'projectId' = ${projectId}`);
  return result.rows as { id: string; singleton_key: string; start_after: Date }[];
}

beforeAll(async () => {
  await seedDemo(db);
  // This file's own leftovers from an earlier run: the demo days' sent rows and the added test addresses.
  await db.delete(sentDigests).where(and(eq(sentDigests.projectId, LARKSPUR), sql`${sentDigests.date} in (${DAY}, ${NEXT_ACTIVE_DAY})`));
  await db.delete(digestRecipients).where(and(eq(digestRecipients.projectId, LARKSPUR), like(digestRecipients.email, "digest-%@example.test")));
  await db.update(digestRecipients).set({ unsubscribedAt: null }).where(and(eq(digestRecipients.projectId, LARKSPUR), eq(digestRecipients.email, owner.email)));
});

afterAll(async () => {
  // Leave no future runs of this file's throwaway projects in the queue.
  const boss = await getBoss();
  for (const id of testProjects) {
    const ids = (await waitingJobs(id)).map((j) => j.id);
    if (ids.length) await boss.cancel(DIGEST_QUEUE, ids);
  }
  await stopQueue();
});

describe("the digest job for Larkspur Commons on 2026-11-17", () => {
  const first: Stored[] = [];

  it("the office adds an address; the owner cannot", async () => {
    const refused = await callRoute(recipientsRoute.POST, { user: owner, params: { projectId: LARKSPUR }, body: { email: "someone@example.test" } });
    expect(refused.status).toBe(403);
    const res = await callRoute(recipientsRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { email: added.toUpperCase() } });
    expect(res.status).toBe(201);
    expect(res.json.email).toBe(added);
    const again = await callRoute(recipientsRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { email: added } });
    expect(again.status).toBe(409);
  });

  it("sends one e-mail per recipient, with the subject, the placements and the warnings", async () => {
    const since = new Date();
    const expected = (await activeRecipients(LARKSPUR)).map((r) => r.email).sort();
    expect(expected).toEqual(expect.arrayContaining([owner.email, added]));

    const report = await runDigestJob({ projectId: LARKSPUR, date: DAY });
    expect([...report!.sent].sort()).toEqual(expected);

    for (const email of expected) {
      const mails = await waitForMail(email, since, "Nov 17");
      expect(mails, email).toHaveLength(1);
      first.push(mails[0]);
    }
    const mail = await raw(first.find((m) => m.to.includes(added))!);
    expect(mail.subject).toBe("Larkspur Commons, Tue, Nov 17: 1 placement, 5 warnings");
    expect(mail.to && "text" in mail.to ? mail.to.text : "").toContain(added);
    // Placements of the day with volume in the project's units, state and signature.
    expect(mail.text).toContain("Level 2 deck [Placed]");
    expect(mail.text).toContain("118.0 yd³ planned · 30.0 yd³ delivered in 3 trucks");
    expect(mail.text).toContain("Not signed yet");
    // Warnings: the rulebook's findings (lib/checks), each naming its rule and who governs.
    expect(mail.text).toContain("! Warning: High evaporation: 0.449 lb/ft²/h (2:00 PM · Level 2 deck)");
    expect(mail.text).toContain("0.1 lb/ft²/h, half the ACI 305R level for a low-bleed mix");
    expect(mail.text).toContain("The project specification, local codes and the engineer of record govern");
    expect(mail.text).toContain("! Caution: Slump out of tolerance: 6.5 in (range 3.0–5.0 in)");
    expect(mail.text).toContain("Rejected: Concrete at 97 °F on arrival");
    expect(mail.text).toContain("Crew on site: 17");
    expect(mail.html).toContain('data-rule="evaporation" data-severity="warning"');
    expect(mail.html).toContain('data-rule="slump" data-severity="caution"');
    expect(mail.html).toContain(`/projects/${LARKSPUR}?date=${DAY}`);
    const listUnsubscribe = mail.headerLines.find((h) => h.key === "list-unsubscribe")?.line ?? "";
    expect(listUnsubscribe).toContain("/api/digest/unsubscribe?token=");
    expect(mail.headerLines.find((h) => h.key === "list-unsubscribe-post")?.line).toContain("List-Unsubscribe=One-Click");
  });

  it("running the job again sends nothing", async () => {
    const since = new Date();
    const report = await runDigestJob({ projectId: LARKSPUR, date: DAY });
    expect(report!.sent).toEqual([]);
    expect(report!.alreadySent.sort()).toEqual(first.map((m) => m.to[0]).sort());
    const sendNow = await callRoute(sendRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { date: DAY } });
    expect(sendNow.status).toBe(200);
    expect(sendNow.json.sent).toEqual([]);
    await new Promise((r) => setTimeout(r, 500));
    for (const m of first) expect(await mailTo(m.to[0], since, "Nov 17")).toHaveLength(0);
    const rows = await db.select().from(sentDigests).where(and(eq(sentDigests.projectId, LARKSPUR), eq(sentDigests.date, DAY)));
    expect(rows.map((r) => r.status)).toEqual(first.map(() => "sent"));
  });

  it("refuses a tampered unsubscribe link and honours the genuine one: the next digest skips the address", async () => {
    const mail = await raw(first.find((m) => m.to.includes(added))!);
    const href = String(mail.html).match(/href="([^"]+)"[^>]*data-link="unsubscribe"/)![1].replace(/&amp;/g, "&");
    const token = new URL(href).searchParams.get("token")!;
    const [payload, signature] = token.split(".");
    const forged = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, "base64url").toString()), e: owner.email })).toString("base64url");
    for (const bad of [`${payload}.${signature.slice(0, -2)}xx`, `${forged}.${signature}`, payload, ""]) {
      const res = await callRoute(unsubscribeRoute.POST, { method: "POST", url: `/api/digest/unsubscribe?token=${bad}` });
      expect(res.status, bad).toBe(400);
    }
    const ok = await callRoute(unsubscribeRoute.POST, { method: "POST", url: `/api/digest/unsubscribe?token=${token}` });
    expect(ok.status).toBe(200);
    expect(ok.json.email).toBe(added);

    const since = new Date();
    const report = await runDigestJob({ projectId: LARKSPUR, date: NEXT_ACTIVE_DAY });
    expect(report!.sent).toContain(owner.email);
    expect(report!.sent).not.toContain(added);
    expect(await waitForMail(owner.email, since, "Nov 19")).toHaveLength(1);
    expect(await mailTo(added, since, "")).toHaveLength(0);
  });

  it("previews the day as HTML for the office only", async () => {
    const url = `/api/projects/${LARKSPUR}/digest/preview?date=${DAY}`;
    const req = new NextRequest(new URL(url, "http://localhost:3100"), { headers: { cookie: await sessionCookie(office) } });
    const asOffice = await preview.GET(req, { params: Promise.resolve({ projectId: LARKSPUR }) });
    expect(asOffice.status).toBe(200);
    expect(asOffice.headers.get("content-type")).toContain("text/html");
    expect(await asOffice.text()).toContain("Level 2 deck");
    expect((await callRoute(preview.GET, { user: owner, url, params: { projectId: LARKSPUR } })).status).toBe(403);
  });
});

describe("owners and their own preferences", () => {
  it("an owner sees and changes only their own row", async () => {
    const { project, team } = await projectWithTeam();
    testProjects.push(project.id);
    await callRoute(recipientsRoute.POST, { user: team.office, params: { projectId: project.id }, body: { email: `digest-${tag}-b@example.test` } });
    const mine = await callRoute(recipientsRoute.GET, { user: team.owner, params: { projectId: project.id } });
    expect(mine.status).toBe(200);
    expect(mine.json.recipients.map((r: { email: string }) => r.email)).toEqual([team.owner.email.toLowerCase()]);
    const all = await callRoute(recipientsRoute.GET, { user: team.office, params: { projectId: project.id } });
    expect(all.json.recipients).toHaveLength(2);
    const other = all.json.recipients.find((r: { source: string }) => r.source === "added");
    const own = mine.json.recipients[0];
    const params = (recipientId: string) => ({ projectId: project.id, recipientId });
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(own.id), body: { hourOverride: 20, sendEmptyDays: false } })).json.hourOverride).toBe(20);
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(other.id), body: { hourOverride: 20 } })).status).toBe(403);
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(own.id), body: { hourOverride: 7 } })).status).toBe(400);
    expect((await callRoute(recipientRoute.DELETE, { user: team.superintendent, method: "DELETE", params: params(other.id) })).status).toBe(403);
    expect((await callRoute(recipientRoute.DELETE, { user: team.office, method: "DELETE", params: params(own.id) })).status).toBe(409);
    expect((await callRoute(recipientRoute.DELETE, { user: team.office, method: "DELETE", params: params(other.id) })).status).toBe(200);
  });
});

describe("the queue", () => {
  it("holds one waiting job per project and day, moved earlier when a recipient's hour is", async () => {
    const { project, team } = await projectWithTeam();
    testProjects.push(project.id);
    const now = new Date("2027-03-01T15:00:00Z"); // 09:00 in Chicago
    const first = await scheduleNext(project.id, now);
    expect(first).toMatchObject({ date: "2027-03-01", sendAt: nextSendTime(now, "America/Chicago", 18) });
    expect(first!.jobId).not.toBeNull();
    const second = await scheduleNext(project.id, now);
    expect(second!.jobId).toBeNull();
    expect(await enqueueDigest({ projectId: project.id, date: "2027-03-01" }, first!.sendAt)).toBeNull();
    let waiting = await waitingJobs(project.id);
    expect(waiting).toHaveLength(1);
    expect(waiting[0].singleton_key).toBe(singletonKey({ projectId: project.id, date: "2027-03-01" }));

    // Through lib, not the route: the route also requeues at once, against the real clock.
    const [own] = (await activeRecipients(project.id)).filter((r) => r.userId === team.owner.id);
    await updateRecipient(await accessTo(team.owner, project.id), own.id, { hourOverride: 13 });
    const moved = await scheduleNext(project.id, now);
    expect(moved!.sendAt.toISOString()).toBe("2027-03-01T19:00:00.000Z");
    waiting = await waitingJobs(project.id);
    expect(waiting).toHaveLength(1);
    expect(new Date(waiting[0].start_after).toISOString()).toBe("2027-03-01T19:00:00.000Z");
  });

  it("retries a run whose SMTP send failed, and the retry sends it once", async () => {
    const { project, team } = await projectWithTeam();
    testProjects.push(project.id);
    const date = "2026-11-18";
    const failing = await closedPortTransport();
    let attempts = 0;
    const worker = await startDigestWorker({
      transport: (job) => (job.projectId === project.id && ++attempts === 1 ? failing : undefined),
      pollingIntervalSeconds: 0.5,
      scheduleOnStart: false,
      rescheduleEveryMs: 0,
    });
    try {
      const since = new Date();
      const jobId = await enqueueDigest({ projectId: project.id, date }, new Date(), { retryLimit: 3, retryDelay: 1, retryBackoff: true });
      const mails = await waitForMail(team.owner.email.toLowerCase(), since, "Nov 18", 25_000);
      expect(mails).toHaveLength(1);
      expect(mails[0].subject).toContain("No placements today");
      expect(attempts).toBeGreaterThanOrEqual(2);
      const job = await (await getBoss()).getJobById(DIGEST_QUEUE, jobId!, { includeArchive: true });
      expect(job?.retryCount).toBeGreaterThanOrEqual(1);
      const [row] = await db.select().from(sentDigests).where(and(eq(sentDigests.projectId, project.id), eq(sentDigests.date, date)));
      expect(row.status).toBe("sent");
      expect(row.messageId).toBeTruthy();
    } finally {
      await worker.stop();
    }
  });
});
