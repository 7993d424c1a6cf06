// Who receives a project's digest: its owners by default (kept in step with the memberships) plus
// the addresses the office adds, each with an hour, an empty-day choice and a way out.
import { and, asc, eq, isNull, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type Executor } from "@/db";
import { transaction } from "@/db/transaction";
import { digestRecipients, projects, users } from "@/db/schema";
import { allows, permit, type ProjectAccess } from "@/lib/auth/access";
import { writeAudit } from "@/lib/audit";
import { conflict, forbidden, invalidInput, notFound } from "@/lib/errors";
import { FIRST_DIGEST_HOUR, LAST_DIGEST_HOUR, hourLabel } from "./hours";
import { verifyUnsubscribe, type UnsubscribeClaim } from "./unsubscribe";

export { unsubscribeUrl, verifyUnsubscribe } from "./unsubscribe";

export type DigestRecipient = typeof digestRecipients.$inferSelect;
export type RecipientView = DigestRecipient & { name: string | null; active: boolean; status: "receiving" | "unsubscribed" | "no longer an owner" };

const HOUR_MESSAGE = `Choose an hour from ${hourLabel(FIRST_DIGEST_HOUR)} to ${hourLabel(LAST_DIGEST_HOUR)}: the digest summarises the day it is sent on`;
const hourSchema = z.number({ error: "Choose an hour" }).int("Choose a whole hour").min(FIRST_DIGEST_HOUR, HOUR_MESSAGE).max(LAST_DIGEST_HOUR, HOUR_MESSAGE);

export const addRecipientSchema = z.object({
  email: z.string({ error: "Enter an e-mail address" }).trim().toLowerCase().pipe(z.email({ error: "Enter a valid e-mail address" }).max(320)),
  hourOverride: hourSchema.nullable().optional(),
  sendEmptyDays: z.boolean({ error: "Choose yes or no" }).optional(),
});

export const updateRecipientSchema = z
  .object({
    hourOverride: hourSchema.nullable().optional(),
    sendEmptyDays: z.boolean({ error: "Choose yes or no" }).optional(),
    subscribed: z.boolean({ error: "Choose yes or no" }).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "Nothing to change" });

export const projectHourSchema = z.object({ digestHour: hourSchema });

/**
 * Every recipient row of the project, with whether the digest currently goes to it. Read only: an
 * owner's row is written with the membership (drizzle/0017), never by looking at the list.
 */
export async function listRecipientRows(projectId: string, tx: Executor = db): Promise<RecipientView[]> {
  const rows = await tx
    .select({
      r: digestRecipients,
      name: users.name,
      isOwner: sql<boolean>`exists (select 1 from memberships m where m.project_id = ${digestRecipients.projectId}
        and m.user_id = ${digestRecipients.userId} and m.role = 'owner') and ${users.disabledAt} is null`,
    })
    .from(digestRecipients)
    .leftJoin(users, eq(users.id, digestRecipients.userId))
    .where(eq(digestRecipients.projectId, projectId))
    .orderBy(asc(digestRecipients.source), asc(digestRecipients.email));
  return rows.map(({ r, name, isOwner }) => {
    const stillOwner = r.source === "added" || isOwner;
    const status = r.unsubscribedAt ? "unsubscribed" : stillOwner ? "receiving" : "no longer an owner";
    return { ...r, name, active: status === "receiving", status };
  });
}

export async function activeRecipients(projectId: string, tx: Executor = db): Promise<DigestRecipient[]> {
  return (await listRecipientRows(projectId, tx)).filter((r) => r.active);
}

async function getRecipientOrThrow(tx: Executor, projectId: string, id: string): Promise<DigestRecipient> {
  if (!z.guid().safeParse(id).success) throw notFound("Recipient");
  const [row] = await tx.select().from(digestRecipients).where(and(eq(digestRecipients.projectId, projectId), eq(digestRecipients.id, id)));
  if (!row) throw notFound("Recipient");
  return row;
}

export async function addRecipient(access: ProjectAccess, input: z.output<typeof addRecipientSchema>) {
  permit(access, "digest.manage");
  const { user, project: { id: projectId } } = access;
  return transaction(async (tx) => {
    const [row] = await tx
      .insert(digestRecipients)
      .values({ projectId, email: input.email, source: "added", hourOverride: input.hourOverride ?? null, sendEmptyDays: input.sendEmptyDays ?? true, addedBy: user.id })
      .onConflictDoNothing()
      .returning();
    if (!row) throw conflict(`${input.email} is already on this project's digest list.`);
    await writeAudit(tx, { projectId, userId: user.id, recordType: "digest_recipients", recordId: row.id, action: "create", after: row });
    return row;
  });
}

/** The office changes anyone's hour or empty-day choice; an owner changes their own and may resubscribe. */
export async function updateRecipient(access: ProjectAccess, id: string, patch: z.output<typeof updateRecipientSchema>) {
  permit(access, ["digest.manage", "digest.subscribe"]);
  const { user, project: { id: projectId } } = access;
  return transaction(async (tx) => {
    const row = await getRecipientOrThrow(tx, projectId, id);
    const own = allows(access, "digest.subscribe") && row.userId === user.id;
    if (!allows(access, "digest.manage") && !own) throw forbidden("You can change only your own digest settings.");
    if (patch.subscribed !== undefined && !own) {
      throw forbidden("Only the recipient can subscribe or unsubscribe themselves; remove an added address instead.");
    }
    const [after] = await tx
      .update(digestRecipients)
      .set({
        ...(patch.hourOverride !== undefined ? { hourOverride: patch.hourOverride } : {}),
        ...(patch.sendEmptyDays !== undefined ? { sendEmptyDays: patch.sendEmptyDays } : {}),
        ...(patch.subscribed !== undefined ? { unsubscribedAt: patch.subscribed ? null : new Date() } : {}),
        updatedAt: new Date(),
      })
      .where(eq(digestRecipients.id, row.id))
      .returning();
    await writeAudit(tx, { projectId, userId: user.id, recordType: "digest_recipients", recordId: row.id, action: "update", before: row, after });
    return after;
  });
}

export async function removeRecipient(access: ProjectAccess, id: string) {
  permit(access, "digest.manage");
  const { user, project: { id: projectId } } = access;
  await transaction(async (tx) => {
    const row = await getRecipientOrThrow(tx, projectId, id);
    if (row.source === "member") {
      throw conflict("Owners receive the digest through their membership; they can unsubscribe themselves.");
    }
    await tx.delete(digestRecipients).where(eq(digestRecipients.id, row.id));
    await writeAudit(tx, { projectId, userId: user.id, recordType: "digest_recipients", recordId: row.id, action: "delete", before: row });
  });
}

export async function setProjectDigestHour(access: ProjectAccess, digestHour: number) {
  permit(access, "digest.manage");
  const { user, project: { id: projectId } } = access;
  await transaction(async (tx) => {
    const [before] = await tx.select({ digestHour: projects.digestHour }).from(projects).where(eq(projects.id, projectId));
    if (!before) throw notFound("Project");
    await tx.update(projects).set({ digestHour, updatedAt: new Date() }).where(eq(projects.id, projectId));
    await writeAudit(tx, { projectId, userId: user.id, recordType: "projects", recordId: projectId, action: "update", before, after: { digestHour } });
  });
}

export const REPLACED_LINK_MESSAGE = "This unsubscribe link was replaced by the one in a newer digest e-mail. Use the link from the most recent digest.";

/** A fresh link claim for the recipient: a new nonce, so every earlier link of theirs stops working. */
export async function issueUnsubscribeClaim(recipient: Pick<DigestRecipient, "id" | "projectId" | "email">): Promise<UnsubscribeClaim> {
  const [row] = await db
    .update(digestRecipients)
    .set({ unsubscribeNonce: sql`gen_random_uuid()` })
    .where(eq(digestRecipients.id, recipient.id))
    .returning({ nonce: digestRecipients.unsubscribeNonce });
  if (!row) throw notFound("Digest subscription");
  return { recipientId: recipient.id, projectId: recipient.projectId, email: recipient.email, nonce: row.nonce };
}

export type UnsubscribeResult = { projectId: string; projectName: string; email: string; alreadyUnsubscribed: boolean };

/** Looks up what a link would unsubscribe, without changing anything (the confirmation page). */
export async function describeUnsubscribe(token: string | null | undefined): Promise<UnsubscribeResult> {
  const claim = verifyUnsubscribe(token);
  if (!claim) throw invalidInput("This unsubscribe link is not valid. Use the link from a recent digest e-mail.");
  const [row] = await db
    .select({ r: digestRecipients, projectName: projects.name })
    .from(digestRecipients)
    .innerJoin(projects, eq(projects.id, digestRecipients.projectId))
    .where(and(eq(digestRecipients.id, claim.recipientId), eq(digestRecipients.projectId, claim.projectId), eq(digestRecipients.email, claim.email)));
  if (!row) throw notFound("Digest subscription");
  // A newer digest carries a newer link; this one was replaced (drizzle/0016).
  if (row.r.unsubscribeNonce !== claim.nonce) throw invalidInput(REPLACED_LINK_MESSAGE);
  return { projectId: row.r.projectId, projectName: row.projectName, email: row.r.email, alreadyUnsubscribed: row.r.unsubscribedAt !== null };
}

/** Stops the digest for the address of a genuine link; a second use changes nothing. */
export async function unsubscribeWithToken(token: string | null | undefined): Promise<UnsubscribeResult> {
  const found = await describeUnsubscribe(token);
  const claim = verifyUnsubscribe(token)!;
  await transaction(async (tx) => {
    const [after] = await tx
      .update(digestRecipients)
      .set({ unsubscribedAt: new Date(), updatedAt: new Date() })
      .where(and(eq(digestRecipients.id, claim.recipientId), eq(digestRecipients.unsubscribeNonce, claim.nonce), isNull(digestRecipients.unsubscribedAt)))
      .returning();
    if (after) {
      await writeAudit(tx, { projectId: after.projectId, userId: after.userId, recordType: "digest_recipients", recordId: after.id, action: "unsubscribe", after, note: "Unsubscribe link" });
    }
  });
  return found;
}
