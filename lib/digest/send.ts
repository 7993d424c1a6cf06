// Sends one project's digest for one date. Exactly-once per (project, date, recipient) comes from
// the sent-digest row: it is claimed before the SMTP call and marked sent after it, so a rerun, a
// retry or a second worker finds the row and sends nothing. A failed send gives its claim back.
import { and, desc, eq, sql } from "drizzle-orm";
import type { SendMailOptions } from "nodemailer";
import { db } from "@/db";
import { projects, sentDigests, users } from "@/db/schema";
import { invalidInput, notFound } from "@/lib/errors";
import { appOrigin, getTransport, mailFrom } from "@/lib/mail/transport";
import { buildDigest, digestLinks } from "./content";
import { loadDigestDay } from "./load";
import { activeRecipients, issueUnsubscribeClaim } from "./recipients";
import { summarizeDay } from "./summary";
import { isLocalDate, zonedTimeToInstant } from "@/lib/time/zone";
import { oneClickUnsubscribeUrl, unsubscribeUrl } from "./unsubscribe";

/** What sendDigest needs of a mail transport; a nodemailer Transporter is one. */
export type MailTransport = { sendMail(mail: SendMailOptions): Promise<{ messageId?: string }> };

/** A claim older than this is from a process that died mid-send; it may be taken over. */
const STALE_CLAIM_MINUTES = 15;

export class DigestSendError extends Error {
  constructor(
    readonly projectId: string,
    readonly date: string,
    readonly failures: { email: string; error: unknown }[],
  ) {
    super(`The mail server did not accept the digest of ${date} for ${failures.map((f) => f.email).join(", ")}`);
    this.name = "DigestSendError";
  }
}

export type SendOptions = {
  transport?: MailTransport;
  /** Only recipients whose hour on the date has come by then (the scheduled job); absent: everyone. */
  dueBy?: Date;
  /** The office user pressing "Send now". */
  sentBy?: string | null;
  origin?: string;
};

export type SendReport = { projectId: string; date: string; sent: string[]; alreadySent: string[]; skippedEmpty: string[]; notDue: string[] };

/** Takes the (project, date, recipient) row; null when it is already sent or being sent. */
async function claim(projectId: string, date: string, email: string, sentBy: string | null): Promise<string | null> {
  const [row] = await db
    .insert(sentDigests)
    .values({ projectId, date, recipientEmail: email, status: "sending", sentBy })
    .onConflictDoUpdate({
      target: [sentDigests.projectId, sentDigests.date, sentDigests.recipientEmail],
      set: { claimedAt: sql`now()`, sentBy },
      setWhere: sql`${sentDigests.status} = 'sending' and ${sentDigests.claimedAt} < now() - make_interval(mins => ${STALE_CLAIM_MINUTES})`,
    })
    .returning({ id: sentDigests.id });
  return row?.id ?? null;
}

export async function sendDigest(projectId: string, date: string, options: SendOptions = {}): Promise<SendReport> {
  if (!isLocalDate(date)) throw invalidInput("Choose a date such as 2026-11-17.", { date: "Choose a valid date" });
  const [project] = await db.select({ digestHour: projects.digestHour, timeZone: projects.timeZone }).from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  const transport = options.transport ?? getTransport();
  const origin = options.origin ?? appOrigin();
  const day = await loadDigestDay(projectId, date);
  const report: SendReport = { projectId, date, sent: [], alreadySent: [], skippedEmpty: [], notDue: [] };
  const failures: DigestSendError["failures"] = [];
  const { isEmpty } = summarizeDay(day);

  for (const r of await activeRecipients(projectId)) {
    if (options.dueBy && zonedTimeToInstant(date, r.hourOverride ?? project.digestHour, project.timeZone) > options.dueBy) {
      report.notDue.push(r.email);
      continue;
    }
    if (isEmpty && !r.sendEmptyDays) {
      report.skippedEmpty.push(r.email);
      continue;
    }
    const claimId = await claim(projectId, date, r.email, options.sentBy ?? null);
    if (!claimId) {
      report.alreadySent.push(r.email);
      continue;
    }
    // Only a message that is really sent carries a new link (and retires the older ones).
    const who = await issueUnsubscribeClaim(r);
    const message = buildDigest(day, digestLinks(origin, projectId, date, unsubscribeUrl(who, origin)));
    try {
      const info = await transport.sendMail({
        from: mailFrom(),
        to: r.email,
        subject: message.subject,
        text: message.text,
        html: message.html,
        // RFC 8058 one-click unsubscribe for mail programs that offer it.
        headers: { "List-Unsubscribe": `<${oneClickUnsubscribeUrl(who, origin)}>`, "List-Unsubscribe-Post": "List-Unsubscribe=One-Click" },
      });
      await db.update(sentDigests).set({ status: "sent", sentAt: new Date(), messageId: info.messageId ?? null }).where(eq(sentDigests.id, claimId));
      report.sent.push(r.email);
    } catch (error) {
      // Give the claim back so the queue's retry (or "Send now") can send this one.
      await db.delete(sentDigests).where(and(eq(sentDigests.id, claimId), eq(sentDigests.status, "sending")));
      failures.push({ email: r.email, error });
    }
  }
  if (failures.length) throw new DigestSendError(projectId, date, failures);
  return report;
}

export type HistoryRow = { date: string; recipientEmail: string; status: "sending" | "sent"; sentAt: Date | null; messageId: string | null; sentByName: string | null };

/** The project's sent digests, newest day first. */
export async function listSentDigests(projectId: string, limit = 200): Promise<HistoryRow[]> {
  return db
    .select({
      date: sentDigests.date,
      recipientEmail: sentDigests.recipientEmail,
      status: sentDigests.status,
      sentAt: sentDigests.sentAt,
      messageId: sentDigests.messageId,
      sentByName: users.name,
    })
    .from(sentDigests)
    .leftJoin(users, eq(users.id, sentDigests.sentBy))
    .where(eq(sentDigests.projectId, projectId))
    .orderBy(desc(sentDigests.date), desc(sentDigests.sentAt), sentDigests.recipientEmail)
    .limit(limit);
}
