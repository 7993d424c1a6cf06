import { publicRoute } from "@/lib/api/handler";
import { clientAddress } from "@/lib/auth/rate-limit";
import { requestSignInLink } from "@/lib/auth/sign-in-link";
import { signInLinkSchema } from "@/lib/users/schemas";

export const POST = publicRoute({ body: signInLinkSchema }, async ({ req, body }) => {
  await requestSignInLink(body.email, body.callbackUrl, clientAddress(req.headers));
  // Same answer whether or not the address has an account.
  return { ok: true };
});
