import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { memberships, projects, signInTokens, users } from "@/db/schema";
import type { ProjectRole } from "@/lib/auth/roles";

export type UserRow = typeof users.$inferSelect;

export async function findUserByEmail(email: string, tx: Executor = db): Promise<UserRow | undefined> {
  const [row] = await tx
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`)
    .limit(1);
  return row;
}

export async function findUserById(id: string, tx: Executor = db): Promise<UserRow | undefined> {
  const [row] = await tx.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

export type UserProject = {
  id: string;
  name: string;
  code: string;
  role: ProjectRole;
  unitSystem: "SI" | "IP";
  timeZone: string;
};

/** The projects a user is a member of, with their role on each. */
export async function listUserProjects(userId: string, tx: Executor = db): Promise<UserProject[]> {
  return userProjectsQuery(userId, tx);
}

/**
 * listUserProjects' statement, not yet run: the sync pull embeds it in its one statement, beside the
 * change counters, the device's row and the open conflicts (lib/sync/server/pull-sql.ts).
 */
export function userProjectsQuery(userId: string, tx: Executor = db) {
  return tx
    .select({
      id: projects.id,
      name: projects.name,
      code: projects.code,
      role: memberships.role,
      unitSystem: projects.unitSystem,
      timeZone: projects.timeZone,
    })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(eq(memberships.userId, userId))
    .orderBy(projects.name);
}

/** Marks a sign-in token used and returns its user, or undefined if unknown, used or expired. */
export async function consumeSignInToken(tokenHash: string): Promise<UserRow | undefined> {
  return db.transaction(async (tx) => {
    const [token] = await tx
      .update(signInTokens)
      .set({ usedAt: new Date() })
      .where(
        and(eq(signInTokens.tokenHash, tokenHash), isNull(signInTokens.usedAt), gt(signInTokens.expiresAt, new Date())),
      )
      .returning();
    if (!token) return undefined;
    return findUserById(token.userId, tx);
  });
}
