import { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { parseOrThrow } from "@/lib/validation";
import { addMember, getProjectForAdmin } from "@/lib/projects/admin";
import { addMemberSchema } from "@/lib/projects/schemas";

type Params = { projectId: string };
const projectId = z.uuid("That is not a project id.");

export const GET = apiRoute<Params>({}, ({ user, params }) => getProjectForAdmin(user, parseOrThrow(projectId, params.projectId)));
export const POST = apiRoute<Params, z.infer<typeof addMemberSchema>>({ body: addMemberSchema }, ({ user, params, body }) =>
  addMember(user, parseOrThrow(projectId, params.projectId), body.email, body.role),
);
