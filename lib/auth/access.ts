// A person's access to one project, resolved once and handed to lib: { user, role, project }.
// The door (lib/api/project-route.ts) resolves it for every project route; a page, the sync push or
// a script resolves it here too, so lib never looks the role up itself. Whether the role allows an
// action is only ever can() (lib/auth/can.ts), applied to the resolved context by permit().
import { and, eq, inArray } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { memberships, projects } from "@/db/schema";
import { z } from "zod";
import { forbidden, notFound } from "@/lib/errors";
import { can, type Action } from "./can";
import type { SessionUser } from "./options";
import type { ProjectRole } from "./roles";

export type Project = typeof projects.$inferSelect;

export type ProjectAccess = {
  user: SessionUser;
  /** The user's role on the project; null for no membership (an administrator on project.manage). */
  role: ProjectRole | null;
  project: Project;
};

/** The context's access to one project: the door's, or one of several resolved at once (the sync push). */
export type AccessSource = { user: SessionUser; access?: ProjectAccess | ReadonlyMap<string, ProjectAccess> };

const DEFAULT_REFUSAL = "Your role on this project does not allow that.";

/** The one role lookup: the project and the user's membership of it, in one query; null when there is no such project. */
export async function resolveAccess(user: SessionUser, projectId: string, tx: Executor = db): Promise<ProjectAccess | null> {
  const [row] = await tx
    .select({ project: projects, role: memberships.role })
    .from(projects)
    .leftJoin(memberships, and(eq(memberships.projectId, projects.id), eq(memberships.userId, user.id)))
    .where(eq(projects.id, projectId))
    .limit(1);
  return row ? { user, role: row.role ?? null, project: row.project } : null;
}

/** The same lookup for several projects (the sync push): only those the user is a member of. */
export async function resolveMemberAccess(user: SessionUser, projectIds: string[], tx: Executor = db): Promise<Map<string, ProjectAccess>> {
  if (projectIds.length === 0) return new Map();
  const rows = await tx
    .select({ project: projects, role: memberships.role })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(and(eq(memberships.userId, user.id), inArray(memberships.projectId, projectIds)));
  return new Map(rows.map((r) => [r.project.id, { user, role: r.role, project: r.project }]));
}

/**
 * Throws forbidden unless the resolved access allows `action` (or one of `actions`), as can()
 * decides; returns the role. No query: the role was resolved once, at the door or by accessTo().
 */
export function permit(access: ProjectAccess, action: Action | readonly Action[], message = DEFAULT_REFUSAL): ProjectRole {
  const { user, role } = access;
  if (role === null) throw forbidden("You are not a member of this project.");
  const actions: readonly Action[] = typeof action === "string" ? [action] : action;
  if (!actions.some((a) => can(user, a, role))) throw forbidden(message);
  return role;
}

/** Whether the access allows `action`: for showing or hiding a control, never for refusing. */
export const allows = (access: ProjectAccess, action: Action): boolean => can(access.user, action, access.role);

/**
 * No project by that id: refused exactly like a project the user does not belong to (role null,
 * so permit() says "not a member"), which tells a caller nothing about which ids exist.
 */
const noProject = (user: SessionUser, projectId: string): ProjectAccess => ({ user, role: null, project: { id: projectId } as Project });

/**
 * For callers that did not come through the door (pages, scripts, tests): the access to hand to
 * lib, which then permits its action on it. A malformed id is not found.
 */
export async function accessTo(user: SessionUser, projectId: string, tx: Executor = db): Promise<ProjectAccess> {
  if (!z.guid().safeParse(projectId).success) throw notFound("Project");
  return (await resolveAccess(user, projectId, tx)) ?? noProject(user, projectId);
}

/**
 * The access a write context carries for `projectId` (the door's, or the push's map). A context
 * without one (a test or a script calling lib directly) is resolved here, the one place that may.
 */
export async function accessIn(ctx: AccessSource, projectId: string, tx: Executor = db): Promise<ProjectAccess> {
  const given = ctx.access instanceof Map ? ctx.access.get(projectId) : (ctx.access as ProjectAccess | undefined);
  if (given && given.project.id === projectId && given.user.id === ctx.user.id) return given;
  if (ctx.access instanceof Map) return noProject(ctx.user, projectId);
  return (await resolveAccess(ctx.user, projectId, tx)) ?? noProject(ctx.user, projectId);
}

/** accessIn, then permit: the write path's check of a record type's action. */
export async function authorizeIn(ctx: AccessSource, action: Action | readonly Action[], projectId: string, tx: Executor = db): Promise<ProjectRole> {
  return permit(await accessIn(ctx, projectId, tx), action);
}
