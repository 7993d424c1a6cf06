import { publicRoute } from "@/lib/api/handler";
import { requestSignInLink } from "@/lib/auth/sign-in-link";
import { signInLinkSchema } from "@/lib/users/schemas";

export const POST = publicRoute({ body: signInLinkSchema }, async ({ body }) => {
  await requestSignInLink(body.email, body.callbackUrl);
  // Same answer whether or not the address has an account.
  return { ok: true };
});
