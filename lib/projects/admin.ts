import { and, asc, count, eq } from "drizzle-orm";
import { db } from "@/db";
import { transaction } from "@/db/transaction";
import { memberships, projects, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { authorizeAdmin } from "@/lib/auth/authorize";
import type { ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/lib/audit";
import { AppError, notFound } from "@/lib/errors";
import { findUserByEmail } from "@/lib/users/queries";
import { projectMembers } from "./queries";
import { parseOrThrow } from "@/lib/validation";
import { refreshProject } from "@/lib/findings/store";
import type { ProjectInput } from "./schemas";
import { projectSpecSchema, type ProjectSpec } from "./spec";

export async function createProject(actor: SessionUser, input: ProjectInput) {
  authorizeAdmin(actor, "admin.projects");
  return transaction(async (tx) => {
    const [clash] = await tx.select({ id: projects.id }).from(projects).where(eq(projects.code, input.code));
    if (clash) throw new AppError("conflict", `The code ${input.code} is taken by another project.`, { code: "Already used." });
    const [project] = await tx.insert(projects).values(input).returning();
    await writeAudit(tx, { projectId: project.id, userId: actor.id, recordType: "project", recordId: project.id, action: "create", after: project });
    return project;
  });
}

export async function listProjectsWithCounts(actor: SessionUser) {
  authorizeAdmin(actor, "admin.projects");
  return db
    .select({ id: projects.id, name: projects.name, code: projects.code, unitSystem: projects.unitSystem, timeZone: projects.timeZone, members: count(memberships.userId) })
    .from(projects)
    .leftJoin(memberships, eq(memberships.projectId, projects.id))
    .groupBy(projects.id)
    .orderBy(asc(projects.name));
}

export async function getProjectForAdmin(actor: SessionUser, projectId: string) {
  authorizeAdmin(actor, "admin.projects");
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  return { project, members: await projectMembers(projectId) };
}

export async function addMember(actor: SessionUser, projectId: string, email: string, role: ProjectRole) {
  authorizeAdmin(actor, "admin.projects");
  const user = await findUserByEmail(email);
  if (!user) {
    throw new AppError("not_found", "No account uses that e-mail address. Invite the person first.", { email: "No account with this address." });
  }
  return transaction(async (tx) => {
    const [project] = await tx.select({ id: projects.id }).from(projects).where(eq(projects.id, projectId));
    if (!project) throw notFound("Project");
    const inserted = await tx.insert(memberships).values({ userId: user.id, projectId, role }).onConflictDoNothing().returning();
    if (inserted.length === 0) {
      throw new AppError("conflict", `${user.name} is already a member of this project. Change the role instead.`, { email: "Already a member." });
    }
    await writeAudit(tx, { projectId, userId: actor.id, recordType: "membership", recordId: user.id, action: "create", after: { email: user.email, role } });
    return inserted[0];
  });
}

export async function changeMemberRole(actor: SessionUser, projectId: string, userId: string, role: ProjectRole) {
  authorizeAdmin(actor, "admin.projects");
  return transaction(async (tx) => {
    const [before] = await tx.select().from(memberships).where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId))).for("update");
    if (!before) throw notFound("Membership");
    const [after] = await tx.update(memberships).set({ role }).where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId))).returning();
    await writeAudit(tx, { projectId, userId: actor.id, recordType: "membership", recordId: userId, action: "update", before: { role: before.role }, after: { role } });
    return after;
  });
}

export async function removeMember(actor: SessionUser, projectId: string, userId: string) {
  authorizeAdmin(actor, "admin.projects");
  return transaction(async (tx) => {
    const [removed] = await tx.delete(memberships).where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId))).returning();
    if (!removed) throw notFound("Membership");
    await writeAudit(tx, { projectId, userId: actor.id, recordType: "membership", recordId: userId, action: "delete", before: { role: removed.role } });
  });
}

export async function listUsers(actor: SessionUser) {
  authorizeAdmin(actor, "admin.users");
  return db
    .select({ id: users.id, name: users.name, email: users.email, isAdmin: users.isAdmin, hasPassword: users.passwordHash, disabledAt: users.disabledAt })
    .from(users)
    .orderBy(asc(users.name))
    .then((rows) => rows.map((r) => ({ ...r, hasPassword: Boolean(r.hasPassword), disabled: r.disabledAt !== null })));
}

/** The project specification's values as stored (SI). */
export const projectSpec = (project: typeof projects.$inferSelect): ProjectSpec => ({
  evaporationHighKgM2H: project.evaporationHighKgM2H,
  maxConcreteTempC: project.maxConcreteTempC,
  dischargeLimitMinutes: project.dischargeLimitMinutes,
  revolutionLimit: project.revolutionLimit,
  coldWeatherDefinition: project.coldWeatherDefinition,
  specEditions: project.specEditions,
  maturityMethod: project.maturityMethod,
  maturityDatumC: project.maturityDatumC,
  maturityActivationEnergyJPerMol: project.maturityActivationEnergyJPerMol,
  maturityTargetMPa: project.maturityTargetMPa,
});

/**
 * Changes the project specification's values (the route door has checked project.manage). Every
 * stored finding of the project is judged again with them in the same transaction, so no surface
 * shows a verdict from the old values; the audit entry keeps both.
 */
export async function updateProjectSpec(actor: SessionUser, project: typeof projects.$inferSelect, input: unknown) {
  const change = parseOrThrow(projectSpecSchema(project.unitSystem), input);
  return db.transaction(async (tx) => {
    const [updated] = await tx.update(projects).set({ ...change, updatedAt: new Date() }).where(eq(projects.id, project.id)).returning();
    await writeAudit(tx, {
      projectId: project.id,
      userId: actor.id,
      recordType: "project",
      recordId: project.id,
      action: "update",
      before: Object.fromEntries(Object.keys(change).map((k) => [k, projectSpec(project)[k as keyof ProjectSpec]])),
      after: change,
    });
    await refreshProject(tx, project.id);
    return projectSpec(updated);
  });
}
