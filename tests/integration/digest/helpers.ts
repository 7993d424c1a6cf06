// The owner's daily digest end to end: the job for the demo project and a demo day sends one
// e-mail per recipient through the local SMTP fake; the mail is parsed back with mailparser; a
// rerun sends nothing; an SMTP failure is retried by the queue; unsubscribe links are signed.
import { readFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { and, eq, like, sql } from "drizzle-orm";
import { simpleParser, type ParsedMail } from "mailparser";
import nodemailer from "nodemailer";
import { afterAll, beforeAll } from "vitest";
import { db } from "@/db";
import { DEMO_IDS, DEMO_USERS } from "@/scripts/seed/ids";
import { seedDemo } from "@/scripts/seed/demo";
import { digestRecipients, sentDigests } from "@/db/schema";
import { DIGEST_QUEUE, getBoss, stopQueue } from "@/lib/digest/queue";
import { type TestUser } from "../helpers";

export const LARKSPUR = DEMO_IDS.projects.larkspur;
export const DAY = "2026-11-17"; // the hot, windy afternoon: level 2 deck, a slump out of tolerance, a rejected load
export const NEXT_ACTIVE_DAY = "2026-11-19"; // the held shear walls and a diary
export const MAILBOX = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";
const MAIL_DIR = path.join(process.env.FAKES_DIR ?? path.join(process.env.PLACEWRIGHT_DATA_DIR ?? ".data", "test-run"), "mail");
export const office = DEMO_USERS.find((u) => u.email === "olu.office@example.test")! as TestUser;
export const owner = DEMO_USERS.find((u) => u.email === "oona.owner@example.test")! as TestUser;
export const tag = randomUUID().slice(0, 8);
export const added = `digest-${tag}@example.test`;
export const testProjects: string[] = [];

export type Stored = { id: string; receivedAt: string; to: string[]; subject: string; text: string; html: string };

/** Messages to one address received since `since` whose subject mentions `about`: other tests' mail is left alone. */
export async function mailTo(email: string, since: Date, about: string): Promise<Stored[]> {
  const res = await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(email)}`);
  const all = (await res.json()) as Stored[];
  return all.filter((m) => new Date(m.receivedAt) >= since && m.subject.includes(about));
}

export async function waitForMail(email: string, since: Date, about: string, timeoutMs = 20_000): Promise<Stored[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await mailTo(email, since, about);
    if (found.length || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
}

export const raw = (m: Stored): Promise<ParsedMail> => simpleParser(readFileSync(path.join(MAIL_DIR, `${m.id}.eml`)));

/** A transport to a port nothing listens on: the first attempt of a send fails like an SMTP outage. */
export async function closedPortTransport() {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true, connectionTimeout: 2_000 });
}

export async function waitingJobs(projectId: string) {
  const result = await db.execute(sql`select id::text as id, singleton_key, start_after from pgboss.job
    where name = ${DIGEST_QUEUE} and state = 'created' and data->>'projectId' = ${projectId}`);
  return result.rows as { id: string; singleton_key: string; start_after: Date }[];
}
/** The demo project without this suite's leftovers before the calling file's tests; no waiting jobs of its projects after. */
export function setUpDigest() {
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
}
