import { apiRoute } from "@/lib/api/handler";
import { createProject, listProjectsWithCounts } from "@/lib/projects/admin";
import { projectSchema } from "@/lib/projects/schemas";

export const GET = apiRoute({}, ({ user }) => listProjectsWithCounts(user));
export const POST = apiRoute({ body: projectSchema }, ({ user, body }) => createProject(user, body));
