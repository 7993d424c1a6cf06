import { apiRoute } from "@/lib/api/handler";
import { inviteSchema } from "@/lib/users/schemas";
import { inviteUser } from "@/lib/users/invitations";

export const POST = apiRoute({ body: inviteSchema }, ({ user, body }) => inviteUser(user, body));
