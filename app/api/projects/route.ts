import { apiRoute } from "@/lib/api/handler";
import { listUserProjects } from "@/lib/users/queries";

/** The projects the signed-in user belongs to, with their role on each. */
export const GET = apiRoute({}, ({ user }) => listUserProjects(user.id));
