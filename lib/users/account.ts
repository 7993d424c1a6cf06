// A person's own account: set or change the password, sign out everywhere.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { consume, refund } from "@/lib/auth/rate-limit";
import { bumpSessionVersion } from "@/lib/auth/user-sessions";
import { writeAudit } from "@/lib/audit";
import { invalidInput, unauthenticated } from "@/lib/errors";
import { findUserById } from "./queries";
import type { ChangePasswordInput } from "./schemas";

export type AccountSummary = { hasPassword: boolean };

export async function accountSummary(user: SessionUser): Promise<AccountSummary> {
  const row = await findUserById(user.id);
  return { hasPassword: Boolean(row?.passwordHash) };
}

/**
 * Sets a first password (a person who came in by e-mailed link, so they can sign off) or changes
 * it (the current one is checked, with the same lock-out as sign-in). Every other session of the
 * person ends; the browser that asked stays signed in.
 */
export async function changePassword(user: SessionUser, input: ChangePasswordInput): Promise<{ otherSessionsEnded: true }> {
  const row = await findUserById(user.id);
  if (!row) throw unauthenticated();
  if (row.passwordHash) {
    // The same throttle as sign-in: an attempt counts before the check and is given back on success.
    await consume("signInEmail", row.email);
    if (!input.currentPassword || !(await verifyPassword(row.passwordHash, input.currentPassword))) {
      throw invalidInput("Your current password is not right.", { currentPassword: "Not your current password." });
    }
    await refund("signInEmail", row.email);
  }
  const passwordHash = await hashPassword(input.newPassword);
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, user.id));
    await bumpSessionVersion(tx, user.id, user.sessionId);
    await writeAudit(tx, {
      projectId: null,
      userId: user.id,
      recordType: "user",
      recordId: user.id,
      action: row.passwordHash ? "change-password" : "set-password",
    });
  });
  return { otherSessionsEnded: true };
}

/** Ends every session of the person, this one included. */
export async function signOutEverywhere(user: SessionUser): Promise<{ ok: true }> {
  await db.transaction(async (tx) => {
    await bumpSessionVersion(tx, user.id);
    await writeAudit(tx, { projectId: null, userId: user.id, recordType: "user", recordId: user.id, action: "sign-out-everywhere" });
  });
  return { ok: true };
}
