// The digest job queue: pg-boss on the app's own PostgreSQL (schema "pgboss"), one queue with one
// waiting job per project and day, started at the project's local digest hour.
import { eq, sql } from "drizzle-orm";
import PgBoss from "pg-boss";
import { db } from "@/db";
import { projects } from "@/db/schema";
import { config } from "@/lib/config";
import { logger } from "@/lib/log";
import { activeRecipients } from "./recipients";
import { digestDateFor, nextSendTime } from "./schedule";

export const DIGEST_QUEUE = "project-digest";
export const PGBOSS_SCHEMA = "pgboss";

export type DigestJob = { projectId: string; date: string };
export type RetryPolicy = { retryLimit: number; retryDelay: number; retryBackoff: boolean };

/** SMTP failures: retried with exponential back-off from 1 min (1–2, 2–4, 4–8 … min), about 2 h in all. */
export const DIGEST_RETRY: RetryPolicy = { retryLimit: 7, retryDelay: 60, retryBackoff: true };

// One instance per process, kept on globalThis so Next's dev reloads do not start a second one.
const globalForBoss = globalThis as typeof globalThis & { placewrightBoss?: Promise<PgBoss> };

async function createBoss(): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: config().database.url,
    schema: PGBOSS_SCHEMA,
    max: 4,
    application_name: "placewright-digest",
    schedule: false, // no cron: each job schedules the next day itself
  });
  boss.on("error", (err) => logger.error({ err }, "digest queue error"));
  await boss.start();
  // "short": at most one waiting job per singleton key, so a project+day is queued once.
  await createQueueOnce(boss, DIGEST_QUEUE, { name: DIGEST_QUEUE, policy: "short", ...DIGEST_RETRY, expireInSeconds: 900 });
  return boss;
}

/**
 * Creates a queue that several instances may create at the same moment: pg-boss's create can then
 * deadlock (40P01) or meet the other's row (23505); the queue exists either way, so try again.
 */
export async function createQueueOnce(boss: PgBoss, name: string, options: Parameters<PgBoss["createQueue"]>[1]): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await boss.createQueue(name, options);
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (attempt >= 5 || (code !== "40P01" && code !== "23505")) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200 * attempt));
    }
  }
}

export function getBoss(): Promise<PgBoss> {
  globalForBoss.placewrightBoss ??= createBoss().catch((error) => {
    globalForBoss.placewrightBoss = undefined;
    throw error;
  });
  return globalForBoss.placewrightBoss;
}

/** True once this process has started the queue (the worker, or a scheduling call). */
export const queueStarted = () => globalForBoss.placewrightBoss !== undefined;

export async function stopQueue(): Promise<void> {
  const pending = globalForBoss.placewrightBoss;
  globalForBoss.placewrightBoss = undefined;
  if (pending) await (await pending).stop({ graceful: true, wait: true, close: true, timeout: 10_000 });
}

export const singletonKey = (job: DigestJob) => `${job.projectId}:${job.date}`;

/** Queues one digest run; null when a job for that project and day is already waiting. */
export async function enqueueDigest(job: DigestJob, startAfter: Date, retry: RetryPolicy = DIGEST_RETRY): Promise<string | null> {
  const boss = await getBoss();
  return boss.send(DIGEST_QUEUE, job, { startAfter, singletonKey: singletonKey(job), ...retry });
}

type Waiting = { id: string; startAfter: Date; date: string };

async function waitingJobs(projectId: string): Promise<Waiting[]> {
  const result = await db.execute(sql`
    select id::text as id, start_after as "startAfter", data->>'date' as date
    from ${sql.identifier(PGBOSS_SCHEMA)}.job
    where name = ${DIGEST_QUEUE} and state = 'created' and data->>'projectId' = ${projectId}`);
  return (result.rows as { id: string; startAfter: Date | string; date: string }[]).map((r) => ({ ...r, startAfter: new Date(r.startAfter) }));
}

export type Scheduled = { date: string; sendAt: Date; jobId: string | null };

/**
 * Makes sure the project's next digest run is queued: at the earliest hour any recipient wants
 * (their own hour or the project's) after `now`. A waiting job that would start later than that
 * (an hour was moved earlier) is cancelled and replaced; one at or before it is kept.
 */
export async function scheduleNext(projectId: string, now: Date = new Date()): Promise<Scheduled | null> {
  const [project] = await db.select({ timeZone: projects.timeZone, digestHour: projects.digestHour }).from(projects).where(eq(projects.id, projectId));
  if (!project) return null;
  const hours = new Set([project.digestHour, ...(await activeRecipients(projectId)).map((r) => r.hourOverride ?? project.digestHour)]);
  const sendAt = [...hours].map((h) => nextSendTime(now, project.timeZone, h)).reduce((a, b) => (b < a ? b : a));
  const date = digestDateFor(sendAt, project.timeZone);
  const boss = await getBoss(); // also installs the pgboss schema on a fresh database
  const waiting = await waitingJobs(projectId);
  const keep = waiting.find((w) => w.startAfter.getTime() <= sendAt.getTime());
  if (keep) return { date: keep.date, sendAt: keep.startAfter, jobId: null };
  if (waiting.length) await boss.cancel(DIGEST_QUEUE, waiting.map((w) => w.id));
  return { date, sendAt, jobId: await enqueueDigest({ projectId, date }, sendAt) };
}

/** scheduleNext for every project (worker start and a periodic check, e.g. for new projects). */
export async function scheduleAllProjects(now: Date = new Date()): Promise<number> {
  const rows = await db.select({ id: projects.id }).from(projects);
  for (const { id } of rows) await scheduleNext(id, now);
  return rows.length;
}
