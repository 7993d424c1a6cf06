import { publicRoute } from "@/lib/api/handler";
import { clientAddress } from "@/lib/auth/rate-limit";
import { acceptInvitationSchema } from "@/lib/users/schemas";
import { acceptInvitation } from "@/lib/users/invitations";

export const POST = publicRoute({ body: acceptInvitationSchema }, ({ req, body }) =>
  acceptInvitation(body.token, body.password, clientAddress(req.headers)),
);
