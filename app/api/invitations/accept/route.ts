import { publicRoute } from "@/lib/api/handler";
import { acceptInvitationSchema } from "@/lib/users/schemas";
import { acceptInvitation } from "@/lib/users/invitations";

export const POST = publicRoute({ body: acceptInvitationSchema }, ({ body }) => acceptInvitation(body.token, body.password));
