// The digest queue: one waiting job per project and day, and retries of a failed SMTP send.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { sentDigests } from "@/db/schema";
import { DIGEST_QUEUE, enqueueDigest, getBoss, scheduleNext, singletonKey } from "@/lib/digest/queue";
import { accessTo } from "@/lib/auth/access";
import { activeRecipients, updateRecipient } from "@/lib/digest/recipients";
import { nextSendTime } from "@/lib/digest/schedule";
import { startDigestWorker } from "@/lib/digest/worker";
import { projectWithTeam } from "../helpers";
import { testProjects, waitForMail, closedPortTransport, waitingJobs, setUpDigest } from "./helpers";

setUpDigest();

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
