import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { memberships, users } from "@/db/schema";
import { permit, type ProjectAccess } from "@/lib/auth/access";

/** A project the user is a member of, with its members; 403 for others (and for no such project). */
export async function getProjectForMember(access: ProjectAccess) {
  const role = permit(access, "project.read");
  const { project } = access;
  return { project, role, members: await projectMembers(project.id) };
}

/** A project's members with their roles, by name. The caller has already checked who may see them. */
export function projectMembers(projectId: string) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.projectId, projectId))
    .orderBy(asc(users.name));
}
