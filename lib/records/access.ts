import type { Executor } from "@/db";
import { can, type Action } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import type { ProjectRole } from "@/lib/auth/roles";
import { forbidden } from "@/lib/errors";
import { getRole } from "@/lib/users/queries";

/**
 * Throws forbidden unless the user may do one of `actions` on the project; returns the role.
 * Decided by lib/auth/can like every other permission: e.g. a delivery is written with
 * "delivery.write" (superintendent) or "record.correct" (office, any unsigned record).
 */
export async function authorizeAny(
  tx: Executor,
  user: SessionUser,
  projectId: string,
  actions: Action[],
): Promise<ProjectRole> {
  const role = await getRole(user.id, projectId, tx);
  if (role === null) throw forbidden("You are not a member of this project.");
  if (!mayDoAny(user, role, actions)) {
    throw forbidden("Your role on this project does not allow that.");
  }
  return role;
}

export const mayDoAny = (user: SessionUser, role: ProjectRole | null, actions: Action[]): role is ProjectRole =>
  role !== null && actions.some((action) => can(user, action, role));

export const writeActions = (action: Action): Action[] => [action, "record.correct"];
