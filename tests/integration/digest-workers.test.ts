// Two digest workers (two processes, as two app instances or `npm run worker` twice would run them)
// on one queue: each digest goes out once per recipient, counted in the SMTP fake. The queue is
// given each day's job twice (the singleton job and a duplicate, as a re-queue after an expired
// job would leave it), so both workers are offered work for the same digest at the same time.
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { and, eq, inArray, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { digestRecipients, sentDigests } from "@/db/schema";
import { DIGEST_QUEUE, enqueueDigest, getBoss, singletonKey, stopQueue } from "@/lib/digest/queue";
import { RESCHEDULE_LOCK, rescheduleOnce } from "@/lib/digest/worker";
import { createProject } from "./helpers";

const MAILBOX = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";
const DATES = ["2026-10-05", "2026-10-06", "2026-10-07"]; // past days: every recipient's hour has come
const tag = randomUUID().slice(0, 8);
const recipients = [`two-workers-a-${tag}@example.test`, `two-workers-b-${tag}@example.test`];
const workers: { child: ChildProcess; out: string[] }[] = [];

function startWorker(): { child: ChildProcess; out: string[] } {
  const out: string[] = [];
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.mts"], {
    env: { ...process.env, DIGEST_POLL_SECONDS: "1", LOG_LEVEL: "info" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d) => out.push(String(d)));
  child.stderr!.on("data", (d) => out.push(String(d)));
  return { child, out };
}

const mailCount = async (email: string) => ((await (await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(email)}`)).json()) as unknown[]).length;

async function until(check: () => Promise<boolean>, timeoutMs: number) {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) return false;
    await new Promise((r) => setTimeout(r, 250));
  }
  return true;
}

let projectId: string;
const jobIds: string[] = [];

beforeAll(async () => {
  const project = await createProject();
  projectId = project.id;
  for (const email of recipients) await db.insert(digestRecipients).values({ projectId, email, source: "added", sendEmptyDays: true });
  const boss = await getBoss();
  for (const date of DATES) {
    const now = new Date();
    jobIds.push((await enqueueDigest({ projectId, date }, now))!);
    // The queue's policy keeps one waiting job per key, so the duplicate carries a key of its own.
    const again = await boss.send(DIGEST_QUEUE, { projectId, date }, { startAfter: now, singletonKey: `${singletonKey({ projectId, date })}:again` });
    jobIds.push(again!);
  }
  await stopQueue(); // this test process only queues; the two child processes work
  workers.push(startWorker(), startWorker());
}, 60_000);

afterAll(async () => {
  for (const w of workers) w.child.kill("SIGTERM");
  await Promise.all(workers.map((w) => (w.child.exitCode === null ? new Promise((r) => w.child.once("exit", r)) : null)));
});

describe("two digest workers", () => {
  it("send each digest once per recipient, whichever worker takes which job", async () => {
    const finished = await until(async () => {
      const rows = await db.execute(sql`select count(*)::int as n from pgboss.job where id::text in (${sql.join(jobIds.map((id) => sql`${id}`), sql`, `)}) and state = 'completed'`);
      return (rows.rows[0] as { n: number }).n === jobIds.length;
    }, 90_000);
    expect(finished, `all ${jobIds.length} jobs completed; worker output:\n${workers.map((w) => w.out.join("")).join("\n---\n")}`).toBe(true);
    // Both processes were up and working the queue.
    for (const w of workers) expect(w.out.join("")).toContain("digest worker running");
    // The SMTP fake received one digest per recipient per day: 3 days, not 6.
    for (const email of recipients) expect(await mailCount(email)).toBe(DATES.length);
    const rows = await db
      .select({ date: sentDigests.date, email: sentDigests.recipientEmail, status: sentDigests.status })
      .from(sentDigests)
      .where(and(eq(sentDigests.projectId, projectId), inArray(sentDigests.recipientEmail, recipients)));
    expect(rows).toHaveLength(DATES.length * recipients.length);
    expect(rows.every((r) => r.status === "sent")).toBe(true);
    const doneLines = workers.map((w) => w.out.join("").split("\n").filter((l) => l.includes('"digest job done"') && l.includes(projectId)).length);
    console.log(`digest jobs done per worker: ${doneLines.join(" + ")} (of ${jobIds.length})`);
    expect(doneLines[0] + doneLines[1]).toBe(jobIds.length);
  }, 150_000);

  it("the periodic schedule check is done by one worker at a time", async () => {
    // Another worker's round in progress: its transaction holds the lock.
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let locked!: () => void;
    const lockTaken = new Promise<void>((r) => (locked = r));
    const other = db.transaction(async (tx) => {
      await tx.execute(sql`select pg_advisory_xact_lock(${RESCHEDULE_LOCK})`);
      locked();
      await held;
    });
    await lockTaken;
    expect(await rescheduleOnce(), "skipped while another worker holds the round").toBeNull();
    release();
    await other;
    expect(await rescheduleOnce()).toBeGreaterThan(0); // the number of projects checked
    await stopQueue();
  }, 120_000);
});
