// What the digest routes and screen may show or do for a signed-in user: the office manages
// (digest.manage), an owner sees and changes only their own preferences, an administrator sees
// who receives what. Project records (the preview) only go to the office.
import { z } from "zod";
import { allows, permit, type ProjectAccess } from "@/lib/auth/access";
import type { ProjectRole } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
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

/** Recipients as this user may see them: all for the office, their own for an owner (lib/auth/can.ts). */
export async function getDigestView(access: ProjectAccess): Promise<DigestView> {
  const { user, project } = access;
  const role = permit(access, "digest.read", "The digest settings are for the office and the project's owners.");
  const canManage = allows(access, "digest.manage");
  const rows = await listRecipientRows(project.id);
  return {
    project: { id: project.id, name: project.name, timeZone: project.timeZone, digestHour: project.digestHour, today: localDate(new Date(), project.timeZone) },
    role,
    canManage,
    recipients: canManage ? rows : rows.filter((r) => r.userId === user.id),
  };
}

export async function previewDigest(access: ProjectAccess, date: string): Promise<DigestMessage> {
  permit(access, "digest.manage");
  const projectId = access.project.id;
  const day = await loadDigestDay(projectId, date);
  return buildDigest(day, digestLinks(appOrigin(), projectId, date, null));
}

export async function sendDigestNow(access: ProjectAccess, date: string): Promise<SendReport> {
  permit(access, "digest.manage");
  try {
    return await sendDigest(access.project.id, date, { sentBy: access.user.id });
  } catch (error) {
    if (error instanceof DigestSendError) {
      throw new AppError("unavailable", `The mail server did not accept the digest for ${error.failures.map((f) => f.email).join(", ")}. Nothing was recorded for them; try again.`);
    }
    throw error;
  }
}

export async function getDigestHistory(access: ProjectAccess): Promise<HistoryRow[]> {
  // An administrator reads it only through a membership, like every project record (lib/auth/can.ts).
  permit(access, "digest.manage");
  return listSentDigests(access.project.id);
}

/** After a change of hours or recipients: requeue at once when this process runs the queue. */
export function rescheduleSoon(projectId: string): void {
  if (!queueStarted()) return; // the worker's periodic check picks the change up
  scheduleNext(projectId).catch((err) => logger.error({ err, projectId }, "digest rescheduling failed"));
}
