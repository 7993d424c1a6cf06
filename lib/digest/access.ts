// What the digest routes and screen may show or do for a signed-in user: the office manages
// (digest.manage), an owner sees and changes only their own preferences, an administrator sees
// who receives what. Project records (the preview) only go to the office.
import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { projects } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { authorize } from "@/lib/auth/authorize";
import { can } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import { AppError, notFound } from "@/lib/errors";
import { logger } from "@/lib/log";
import { buildDigest, digestLinks, type DigestMessage } from "./content";
import { loadDigestDay } from "./load";
import { queueStarted, scheduleNext } from "./queue";
import { listRecipientRows, type RecipientView } from "./recipients";
import { localDate } from "@/lib/time/zone";
import { DigestSendError, listSentDigests, sendDigest, type HistoryRow, type SendReport } from "./send";
import { appOrigin } from "@/lib/mail/transport";

export const digestDateSchema = z.iso.date({ error: "Choose a date such as 2026-11-17" });
export const sendNowSchema = z.object({ date: digestDateSchema });

export type DigestView = {
  project: { id: string; name: string; timeZone: string; digestHour: number; today: string };
  role: ProjectRole | null;
  canManage: boolean;
  recipients: RecipientView[];
};

async function projectOrThrow(projectId: string) {
  if (!z.guid().safeParse(projectId).success) throw notFound("Project");
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  return project;
}

/** Recipients as this user may see them: all for the office, their own for an owner (lib/auth/can.ts). */
export async function getDigestView(user: SessionUser, projectId: string): Promise<DigestView> {
  const project = await projectOrThrow(projectId);
  const role = await authorize(user, "digest.read", projectId, undefined, "The digest settings are for the office and the project's owners.");
  const canManage = can(user, "digest.manage", role);
  const rows = await listRecipientRows(projectId);
  return {
    project: { id: project.id, name: project.name, timeZone: project.timeZone, digestHour: project.digestHour, today: localDate(new Date(), project.timeZone) },
    role,
    canManage,
    recipients: canManage ? rows : rows.filter((r) => r.userId === user.id),
  };
}

export async function previewDigest(user: SessionUser, projectId: string, date: string): Promise<DigestMessage> {
  await projectOrThrow(projectId);
  await authorize(user, "digest.manage", projectId);
  const day = await loadDigestDay(projectId, date);
  return buildDigest(day, digestLinks(appOrigin(), projectId, date, null));
}

export async function sendDigestNow(user: SessionUser, projectId: string, date: string): Promise<SendReport> {
  await projectOrThrow(projectId);
  await authorize(user, "digest.manage", projectId);
  try {
    return await sendDigest(projectId, date, { sentBy: user.id });
  } catch (error) {
    if (error instanceof DigestSendError) {
      throw new AppError("unavailable", `The mail server did not accept the digest for ${error.failures.map((f) => f.email).join(", ")}. Nothing was recorded for them; try again.`);
    }
    throw error;
  }
}

export async function getDigestHistory(user: SessionUser, projectId: string): Promise<HistoryRow[]> {
  await projectOrThrow(projectId);
  // An administrator reads it only through a membership, like every project record (lib/auth/can.ts).
  await authorize(user, "digest.manage", projectId);
  return listSentDigests(projectId);
}

/** After a change of hours or recipients: requeue at once when this process runs the queue. */
export function rescheduleSoon(projectId: string): void {
  if (!queueStarted()) return; // the worker's periodic check picks the change up
  scheduleNext(projectId).catch((err) => logger.error({ err, projectId }, "digest rescheduling failed"));
}
