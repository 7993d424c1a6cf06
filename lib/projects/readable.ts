// The one answer to "which projects may this person read": their memberships, each allowed by
// can("project.read") (lib/auth/can.ts). It serves every cross-project view: the project list and
// the app shell, the office review lists, the lab queue and the sync pull. The admin flag adds
// nothing here (it manages projects; it reads their records only through a membership).
import { db, type Executor } from "@/db";
import { can } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { listUserProjects, type UserProject } from "@/lib/users/queries";

type Reader = Pick<SessionUser, "id" | "isAdmin">;

/**
 * The readable projects, by name; with `requested`, exactly those (deduplicated), and a request for
 * one the user may not read is refused, not ignored.
 */
export async function readableProjects(user: Reader, requested?: string[], tx: Executor = db): Promise<UserProject[]> {
  const mine = readableAmong(user, await listUserProjects(user.id, tx));
  if (!requested || requested.length === 0) return mine;
  const byId = new Map(mine.map((p) => [p.id, p]));
  const refused = requested.filter((id) => !byId.has(id.toLowerCase()));
  if (refused.length) throw forbidden("You are not a member of every project you asked for.");
  return [...new Set(requested.map((id) => id.toLowerCase()))].map((id) => byId.get(id)!);
}

/** Of a user's memberships (listUserProjects' rows, or a statement built on userProjectsQuery), the readable ones. */
export function readableAmong<P extends { role: UserProject["role"] }>(user: Reader, memberships: P[]): P[] {
  return memberships.filter((p) => can(user, "project.read", p.role));
}
