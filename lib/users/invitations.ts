import { and, asc, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db";
import { invitations, memberships, projects, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { authorizeAdmin } from "@/lib/auth/authorize";
import { hashPassword } from "@/lib/auth/password";
import { consume, refund } from "@/lib/auth/rate-limit";
import { hashToken, newToken } from "@/lib/auth/tokens";
import { writeAudit } from "@/lib/audit";
import { AppError, notFound } from "@/lib/errors";
import { appOrigin, sendMail } from "@/lib/mail/transport";
import { invitationMail } from "@/lib/mail/templates";
import type { InviteInput } from "./schemas";
import { findUserByEmail } from "./queries";

export const INVITATION_DAYS = 7;

const invitationGone = () =>
  new AppError("not_found", "This invitation has expired or was already used. Ask an administrator for a new one.");

/** Admin invites a person by e-mail, optionally straight into a project with a role. */
export async function inviteUser(actor: SessionUser, input: InviteInput): Promise<{ id: string }> {
  authorizeAdmin(actor, "admin.invite");
  const existing = await findUserByEmail(input.email);
  if (existing?.passwordHash) {
    throw new AppError("conflict", "That person already has an account. Add them to a project instead.", {
      email: "Already has an account.",
    });
  }
  const { token, tokenHash } = newToken();
  const { invitation, projectName } = await db.transaction(async (tx) => {
    let projectName: string | null = null;
    if (input.projectId) {
      const [project] = await tx.select().from(projects).where(eq(projects.id, input.projectId));
      if (!project) throw notFound("Project");
      projectName = project.name;
    }
    const [invitation] = await tx
      .insert(invitations)
      .values({
        email: input.email,
        name: input.name,
        tokenHash,
        projectId: input.projectId ?? null,
        role: input.role ?? null,
        invitedBy: actor.id,
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
      })
      .returning();
    await writeAudit(tx, {
      projectId: input.projectId ?? null,
      userId: actor.id,
      recordType: "invitation",
      recordId: invitation.id,
      action: "create",
      after: { email: input.email, name: input.name, role: input.role ?? null },
    });
    return { invitation, projectName };
  });
  // Side effect after commit.
  const url = `${appOrigin()}/invite?token=${encodeURIComponent(token)}`;
  await sendMail({ to: input.email, ...invitationMail(input.name, actor.name, projectName, url, INVITATION_DAYS) });
  return { id: invitation.id };
}

/** The invitee sets a password; creates the account (and membership) and consumes the invitation. */
export async function acceptInvitation(token: string, password: string, fromAddress = "unknown"): Promise<{ email: string }> {
  await consume("invitationIp", fromAddress);
  // The token first: argon2 is expensive, and an unknown token must not cost the server a hash.
  const [live] = await db
    .select({ id: invitations.id })
    .from(invitations)
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())));
  if (!live) throw invitationGone();
  const passwordHash = await hashPassword(password);
  const accepted = await db.transaction(async (tx) => {
    const [invitation] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(
        and(
          eq(invitations.tokenHash, hashToken(token)),
          isNull(invitations.acceptedAt),
          gt(invitations.expiresAt, new Date()),
        ),
      )
      .returning();
    if (!invitation) throw invitationGone();
    let user = await findUserByEmail(invitation.email, tx);
    if (user?.passwordHash) {
      throw new AppError("conflict", "This address already has an account. Sign in instead.");
    }
    if (user) {
      [user] = await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, user.id)).returning();
    } else {
      [user] = await tx.insert(users).values({ email: invitation.email, name: invitation.name, passwordHash }).returning();
    }
    if (invitation.projectId && invitation.role) {
      await tx
        .insert(memberships)
        .values({ userId: user.id, projectId: invitation.projectId, role: invitation.role })
        .onConflictDoNothing();
    }
    await writeAudit(tx, {
      projectId: invitation.projectId,
      userId: user.id,
      recordType: "user",
      recordId: user.id,
      action: "accept-invitation",
      after: { email: user.email, role: invitation.role },
    });
    return { email: user.email };
  });
  await refund("invitationIp", fromAddress);
  return accepted;
}

export async function findOpenInvitation(token: string) {
  const [row] = await db
    .select({ email: invitations.email, name: invitations.name })
    .from(invitations)
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())));
  return row;
}

/**
 * Invitations sent and not yet accepted nor expired, for the People page: the person has no account
 * until they accept, so without this list an invitation just sent would be nowhere on the page.
 */
export async function listPendingInvitations(actor: SessionUser, now: Date = new Date()) {
  authorizeAdmin(actor, "admin.users");
  return db
    .select({ id: invitations.id, name: invitations.name, email: invitations.email, role: invitations.role, projectName: projects.name, expiresAt: invitations.expiresAt })
    .from(invitations)
    .leftJoin(projects, eq(projects.id, invitations.projectId))
    .where(and(isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
    .orderBy(asc(invitations.createdAt));
}
