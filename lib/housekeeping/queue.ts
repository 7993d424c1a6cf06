// The housekeeping job on the app's pg-boss queue (the digest's instance, lib/digest/queue.ts):
// one waiting job at a time ("short" policy + singleton key); each run queues the next one, so a
// crashed run or a restart never leaves it unscheduled, and several instances never double it.
import type { Job } from "pg-boss";
import { createQueueOnce, getBoss } from "@/lib/digest/queue";
import { runHousekeeping } from "./prune";

export const HOUSEKEEPING_QUEUE = "housekeeping";
export const HOUSEKEEPING_EVERY_MS = 60 * 60_000;

async function queueNext(delayMs: number): Promise<string | null> {
  const boss = await getBoss();
  return boss.send(HOUSEKEEPING_QUEUE, {}, { singletonKey: "housekeeping", startAfter: new Date(Date.now() + delayMs), retryLimit: 3, retryDelay: 300 });
}

/** Creates the queue (once); run by the owner's setup too, so the app's role needs no DDL. */
export async function ensureHousekeepingQueue(boss: Awaited<ReturnType<typeof getBoss>>): Promise<void> {
  await createQueueOnce(boss, HOUSEKEEPING_QUEUE, { name: HOUSEKEEPING_QUEUE, policy: "short", expireInSeconds: 900 });
}

export async function startHousekeepingWorker(): Promise<{ stop: () => Promise<void> }> {
  const boss = await getBoss();
  await ensureHousekeepingQueue(boss);
  const workId = await boss.work(HOUSEKEEPING_QUEUE, { pollingIntervalSeconds: 30, batchSize: 1 }, async (jobs: Job[]) => {
    if (!jobs.length) return;
    await queueNext(HOUSEKEEPING_EVERY_MS);
    const report = await runHousekeeping();
    console.log("[housekeeping]", JSON.stringify(report));
  });
  await queueNext(0);
  return { stop: () => boss.offWork({ id: workId }) };
}
