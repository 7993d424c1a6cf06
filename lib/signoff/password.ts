import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { verifyPassword } from "@/lib/auth/password";
import { AppError } from "@/lib/errors";

/** The re-entered password of a signature: a wrong one is 401 and nothing is stored. */
export async function checkSignerPassword(user: SessionUser, password: string): Promise<void> {
  const [account] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, user.id));
  if (!(await verifyPassword(account?.passwordHash ?? null, password))) {
    throw new AppError("unauthenticated", "That password is not right. Nothing was signed.", { password: "Wrong password." });
  }
}
