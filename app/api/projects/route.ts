import { apiRoute } from "@/lib/api/handler";
import { readableProjects } from "@/lib/projects/readable";

/** The projects the signed-in user may read, with their role on each. */
export const GET = apiRoute({}, ({ user }) => readableProjects(user));
