import { can, type Action } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import type { ProjectRole } from "@/lib/auth/roles";

export const mayDoAny = (user: SessionUser, role: ProjectRole | null, actions: readonly Action[]): role is ProjectRole =>
  role !== null && actions.some((action) => can(user, action, role));

/** A record type's write action, or the office's correction of any unsigned record. */
export const writeActions = (action: Action): Action[] => [action, "record.correct"];
