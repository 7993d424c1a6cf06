// The digest worker: runs each project's job when its hour comes, then the next day's is queued.
// Started with the app (instrumentation.ts) or alone (`npm run worker`).
import { eq, sql } from "drizzle-orm";
import type { Job } from "pg-boss";
import { db } from "@/db";
import { transaction } from "@/db/transaction";
import { projects } from "@/db/schema";
import { logger } from "@/lib/log";
import { DIGEST_QUEUE, getBoss, scheduleAllProjects, scheduleNext, type DigestJob } from "./queue";
import { sendDigest, type MailTransport, type SendReport } from "./send";

export type WorkerOptions = {
  /** The SMTP transport for a run (default: the app's, from SMTP_URL). */
  transport?: (job: DigestJob) => MailTransport | undefined;
  now?: () => Date;
  pollingIntervalSeconds?: number;
  /** How often every project's next run is checked (new projects, changed hours); 0: only at start. */
  rescheduleEveryMs?: number;
  /** Check every project's next run at start (default true). */
  scheduleOnStart?: boolean;
};

/**
 * One run: queue the following run first (so an SMTP outage that exhausts the retries cannot end
 * the chain), then send to every recipient whose hour has come. Throwing makes pg-boss retry.
 */
export async function runDigestJob(job: DigestJob, options: WorkerOptions = {}): Promise<SendReport | null> {
  const now = options.now?.() ?? new Date();
  const [project] = await db.select({ id: projects.id }).from(projects).where(eq(projects.id, job.projectId));
  if (!project) return null; // the project was deleted after the job was queued
  await scheduleNext(job.projectId, now);
  return sendDigest(job.projectId, job.date, { transport: options.transport?.(job), dueBy: now });
}

export type DigestWorker = { stop: () => Promise<void> };

/** The advisory lock key of the periodic schedule check (any 64-bit number of our own). */
export const RESCHEDULE_LOCK = sql`hashtext('placewright:digest-reschedule')`;

/**
 * The periodic check of every project's next run, done by one worker at a time: every instance's
 * worker runs the timer, the one that takes the advisory lock does the round and the others skip
 * it (null). The lock is held by a transaction, so a worker that dies mid-round releases it.
 */
export async function rescheduleOnce(now?: Date): Promise<number | null> {
  return transaction(async (tx) => {
    const result = await tx.execute(sql`select pg_try_advisory_xact_lock(${RESCHEDULE_LOCK}) as got`);
    if (!(result.rows[0] as { got: boolean }).got) return null;
    return scheduleAllProjects(now);
  });
}

export async function startDigestWorker(options: WorkerOptions = {}): Promise<DigestWorker> {
  const boss = await getBoss();
  const workId = await boss.work<DigestJob>(
    DIGEST_QUEUE,
    { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 10, batchSize: 1 },
    async (jobs: Job<DigestJob>[]) => {
      for (const job of jobs) {
        const report = await runDigestJob(job.data, options);
        logger.info({ jobId: job.id, projectId: job.data.projectId, date: job.data.date, sent: report?.sent.length ?? 0, alreadySent: report?.alreadySent.length ?? 0 }, "digest job done");
      }
    },
  );
  const reschedule = () => rescheduleOnce(options.now?.()).catch((err) => logger.error({ err }, "digest scheduling failed"));
  // In the background: with many projects this takes a while, and the app must not wait for it.
  if (options.scheduleOnStart ?? true) void reschedule();
  const every = options.rescheduleEveryMs ?? 10 * 60_000;
  const timer = every > 0 ? setInterval(reschedule, every) : undefined;
  timer?.unref();
  return {
    stop: async () => {
      if (timer) clearInterval(timer);
      await boss.offWork({ id: workId });
    },
  };
}
