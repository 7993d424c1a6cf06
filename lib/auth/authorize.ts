import { db, type Executor } from "@/db";
import { forbidden } from "@/lib/errors";
import { getRole } from "@/lib/users/queries";
import { can, type Action, type AdminAction } from "./can";
import type { SessionUser } from "./options";
import type { ProjectRole } from "./roles";

/** Throws forbidden unless the user may do `action` on the project; returns the user's role there. */
export async function authorize(
  user: SessionUser,
  action: Action,
  projectId: string,
  tx: Executor = db,
): Promise<ProjectRole | null> {
  const role = await getRole(user.id, projectId, tx);
  if (!can(user, action, role)) {
    throw forbidden(
      role === null && !user.isAdmin
        ? "You are not a member of this project."
        : "Your role on this project does not allow that.",
    );
  }
  return role;
}

export function authorizeAdmin(user: SessionUser, action: AdminAction): void {
  if (!can(user, action, null)) throw forbidden("Only an administrator can do that.");
}
