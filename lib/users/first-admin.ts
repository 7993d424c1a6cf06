import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { findUserByEmail } from "./queries";
import type { FirstAdminInput } from "./schemas";

/**
 * Creates the first administrator of an empty installation (production start, from the command
 * line). Refused once any administrator exists: further people are invited from the People page.
 */
export async function createFirstAdmin(input: FirstAdminInput): Promise<{ id: string }> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    // Serialise two concurrent runs on the same empty database.
    await tx.execute(sql`select pg_advisory_xact_lock(727301)`);
    const [existing] = await tx.select({ email: users.email }).from(users).where(eq(users.isAdmin, true)).limit(1);
    if (existing) {
      throw new AppError("conflict", `An administrator already exists (${existing.email}). Sign in as them and invite people from the People page.`);
    }
    if (await findUserByEmail(input.email, tx)) {
      throw new AppError("conflict", `An account with ${input.email} already exists; choose another address.`);
    }
    const [user] = await tx.insert(users).values({ email: input.email, name: input.name, passwordHash, isAdmin: true }).returning();
    await writeAudit(tx, { projectId: null, userId: user.id, recordType: "user", recordId: user.id, action: "create-first-admin", after: { email: user.email } });
    return { id: user.id };
  });
}
