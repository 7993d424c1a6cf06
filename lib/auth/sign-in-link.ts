import { db } from "@/db";
import { signInTokens } from "@/db/schema";
import { appOrigin, sendMail } from "@/lib/mail/transport";
import { signInLinkMail } from "@/lib/mail/templates";
import { findUserByEmail } from "@/lib/users/queries";
import { safeCallbackPath } from "./callback-url";
import { consume } from "./rate-limit";
import { newToken } from "./tokens";

export const LINK_MINUTES = 15;

/**
 * Sends a one-time sign-in link when the address has an active account. The caller answers the
 * same way either way, so the form does not reveal which addresses have accounts.
 */
export async function requestSignInLink(email: string, callbackUrl = "/", fromAddress = "unknown"): Promise<void> {
  // Counted whether or not the address has an account, so the limit reveals nothing either.
  await consume("linkIp", fromAddress);
  await consume("linkEmail", email);
  const user = await findUserByEmail(email);
  if (!user || user.disabledAt) return;
  const { token, tokenHash } = newToken();
  await db.insert(signInTokens).values({
    tokenHash,
    userId: user.id,
    expiresAt: new Date(Date.now() + LINK_MINUTES * 60_000),
  });
  const url = `${appOrigin()}/signin/link?token=${encodeURIComponent(token)}&callbackUrl=${encodeURIComponent(safeCallbackPath(callbackUrl, "/"))}`;
  await sendMail({ to: user.email, ...signInLinkMail(user.name, url, LINK_MINUTES) });
}
