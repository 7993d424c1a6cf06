import { forbidden } from "@/lib/errors";
import { can, type AdminAction } from "./can";
import type { SessionUser } from "./options";

/** Administration is decided by the admin flag, not by a role on a project (lib/auth/can.ts). */
export function authorizeAdmin(user: SessionUser, action: AdminAction): void {
  if (!can(user, action, null)) throw forbidden("Only an administrator can do that.");
}
