import { db, type Executor } from "@/db";
import { forbidden } from "@/lib/errors";
import { getRole } from "@/lib/users/queries";
import { can, type Action, type AdminAction } from "./can";
import type { SessionUser } from "./options";
import type { ProjectRole } from "./roles";

/**
 * The one server-side check inside lib: throws forbidden unless the user may do `action` (or one
 * of `actions`) on the project, as lib/auth/can.ts decides; returns the user's role there. Route
 * handlers check once at the door (lib/api/project-route.ts); lib calls this where it is reached
 * without one (pages, the sync push) or needs a finer action than the route's.
 * E.g. a delivery is written with "delivery.write" (superintendent) or "record.correct" (office).
 * Always needs a membership: project.manage (the admin flag's) is checked at the door only.
 */
export async function authorize(
  user: SessionUser,
  action: Action | readonly Action[],
  projectId: string,
  tx: Executor = db,
  message = "Your role on this project does not allow that.",
): Promise<ProjectRole> {
  const role = await getRole(user.id, projectId, tx);
  if (role === null) throw forbidden("You are not a member of this project.");
  const actions: readonly Action[] = typeof action === "string" ? [action] : action;
  if (!actions.some((a) => can(user, a, role))) throw forbidden(message);
  return role;
}

export function authorizeAdmin(user: SessionUser, action: AdminAction): void {
  if (!can(user, action, null)) throw forbidden("Only an administrator can do that.");
}
