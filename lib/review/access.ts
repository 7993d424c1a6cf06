// Which projects a review list may read: the user's memberships, each allowed by can() (the one
// permission door). Explicitly requested projects the user may not read are refused, not ignored.
import { db, type Executor } from "@/db";
import { can } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { listUserProjects, type UserProject } from "@/lib/users/queries";

export async function readableProjects(user: SessionUser, requested: string[] | undefined, tx: Executor = db): Promise<UserProject[]> {
  const mine = (await listUserProjects(user.id, tx)).filter((p) => can(user, "project.read", p.role));
  if (!requested || requested.length === 0) return mine;
  const byId = new Map(mine.map((p) => [p.id, p]));
  const refused = requested.filter((id) => !byId.has(id.toLowerCase()));
  if (refused.length) throw forbidden("You are not a member of every project you asked for.");
  return [...new Set(requested.map((id) => id.toLowerCase()))].map((id) => byId.get(id)!);
}

/** A Postgres uuid[] literal of already validated ids (one bound parameter, whatever the count). */
export const uuidArray = (ids: string[]) => `{${ids.join(",")}}`;
