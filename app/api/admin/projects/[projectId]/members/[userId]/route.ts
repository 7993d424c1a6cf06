import { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { parseOrThrow } from "@/lib/validation";
import { changeMemberRole, removeMember } from "@/lib/projects/admin";
import { changeRoleSchema } from "@/lib/projects/schemas";

type Params = { projectId: string; userId: string };
const ids = z.object({ projectId: z.uuid("That is not a project id."), userId: z.uuid("That is not a user id.") });

export const PATCH = apiRoute<Params, z.infer<typeof changeRoleSchema>>({ body: changeRoleSchema }, ({ user, params, body }) => {
  const { projectId, userId } = parseOrThrow(ids, params);
  return changeMemberRole(user, projectId, userId, body.role);
});

export const DELETE = apiRoute<Params>({}, async ({ user, params }) => {
  const { projectId, userId } = parseOrThrow(ids, params);
  await removeMember(user, projectId, userId);
  return { ok: true };
});
