import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { memberships, projects, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { authorize } from "@/lib/auth/authorize";
import { notFound } from "@/lib/errors";

/** A project the user is a member of, with its members; 403 for others, 404 when it does not exist. */
export async function getProjectForMember(user: SessionUser, projectId: string) {
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  const role = await authorize(user, "project.read", projectId);
  const members = await db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.projectId, projectId))
    .orderBy(asc(users.name));
  return { project, role, members };
}
