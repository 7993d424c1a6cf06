import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { verifyPassword } from "@/lib/auth/password";
import { consume, refund } from "@/lib/auth/rate-limit";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";

export type SignedThing = { projectId: string; recordType: string; recordId: string };

/**
 * The re-entered password of a signature: a wrong one is 401 and nothing is signed, but the attempt
 * is audited (its own short transaction: the signing one never starts) and counts against the
 * signer's limit, so a left-open session cannot be used to guess the password.
 */
export async function checkSignerPassword(user: SessionUser, password: string, what: SignedThing): Promise<void> {
  await consume("signerPassword", user.id);
  const [account] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, user.id));
  if (!(await verifyPassword(account?.passwordHash ?? null, password))) {
    await writeAudit(db, { projectId: what.projectId, userId: user.id, recordType: what.recordType, recordId: what.recordId, action: "sign-password-failed" });
    throw new AppError("unauthenticated", "That password is not right. Nothing was signed.", { password: "Wrong password." });
  }
  await refund("signerPassword", user.id);
}
