import { NextResponse, type NextRequest } from "next/server";
import { z, type ZodType } from "zod";
import { resolveAccess, type Project, type ProjectAccess } from "@/lib/auth/access";
import { can, type Action } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import type { ProjectRole } from "@/lib/auth/roles";
import { requireUser } from "@/lib/auth/session";
import { AppError, forbidden, invalidInput } from "@/lib/errors";
import { errorResponse, readBody } from "./handler";
import { checkOrigin } from "./request-guard";

export type { Project };

export type ProjectRouteCtx<P, B> = {
  req: NextRequest;
  user: SessionUser;
  /** The user's role on the project; null only for an administrator on a project.manage route. */
  role: ProjectRole | null;
  project: Project;
  /** { user, role, project } as one value, to hand to lib. */
  access: ProjectAccess;
  params: P;
  body: B;
};

/** Path ids are UUIDs: `projectId`, `id` and every parameter whose name ends in `Id`. */
const isIdParam = (name: string) => name === "id" || name.endsWith("Id");

/** Malformed → 400 naming the parameter (before any query, so never a database error as 500). */
export function parsePathIds<P extends Record<string, string>>(raw: P): P {
  const fields: Record<string, string> = {};
  for (const [name, value] of Object.entries(raw)) {
    if (isIdParam(name) && !z.uuid().safeParse(value).success) fields[name] = `The path parameter ${name} is not a valid id.`;
  }
  const first = Object.values(fields)[0];
  if (first) throw invalidInput(first, fields);
  return raw;
}

/** One answer for a project that does not exist and one the user does not belong to: no existence oracle. */
const projectNotFound = () => new AppError("not_found", "Project not found.");

/** The door's policy on the one lookup: missing or foreign → 404, a member without the action → 403. */
export async function projectAccess(user: SessionUser, projectId: string, action: Action): Promise<ProjectAccess> {
  const access = await resolveAccess(user, projectId);
  if (!access) throw projectNotFound();
  if (!can(user, action, access.role)) {
    if (access.role === null) throw projectNotFound();
    throw forbidden("Your role on this project does not allow that.");
  }
  return access;
}

/**
 * The door of every route under /api/projects/[projectId]: origin check → authenticate → path ids
 * (400) → project and role, once (404 for missing or foreign) → can(action) (403) → body (size
 * capped, then the schema) → lib, with { user, role, project }.
 * `action` is the least a caller must hold; lib applies the finer rule of a record type or a move
 * (which write action, which transition) from lib/auth/can.ts.
 */
export function projectRoute<P extends { projectId: string }, B = undefined>(
  options: { action: Action; body?: ZodType<B>; maxBodyBytes?: number },
  handler: (ctx: ProjectRouteCtx<P, B>) => Promise<unknown>,
) {
  return async (req: NextRequest, context: { params: Promise<P> }) => {
    try {
      checkOrigin(req);
      const user = await requireUser(req);
      const params = parsePathIds((await context.params) ?? ({} as P));
      const access = await projectAccess(user, params.projectId, options.action);
      const body = await readBody(req, options);
      const result = await handler({ req, user, role: access.role, project: access.project, access, params, body });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
