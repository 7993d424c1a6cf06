// Signed unsubscribe links: no sign-in needed, so the link itself must be unforgeable. The token is
// the recipient's id, project, address and current nonce with an HMAC-SHA256 keyed from
// NEXTAUTH_SECRET. Issuing a link rotates the nonce (recipients.ts issueUnsubscribeClaim), so a link
// from an older e-mail, or one that leaked, stops working once a newer one is sent.
import { createHmac, timingSafeEqual } from "node:crypto";
import { z } from "zod";
import { config } from "@/lib/config";
import { appOrigin } from "@/lib/mail/transport";

export type UnsubscribeClaim = { recipientId: string; projectId: string; email: string; nonce: string };

const payloadSchema = z.object({ r: z.guid(), p: z.guid(), e: z.string().min(3).max(320), n: z.guid() });

function key(): Buffer {
  const { secret } = config().auth;
  // A key of its own, so an unsubscribe signature can never be replayed as any other signed value.
  return createHmac("sha256", secret).update("placewright:digest-unsubscribe:v2").digest();
}

const sign = (payload: string) => createHmac("sha256", key()).update(payload).digest("base64url");

export function unsubscribeToken(claim: UnsubscribeClaim): string {
  const payload = Buffer.from(JSON.stringify({ r: claim.recipientId, p: claim.projectId, e: claim.email, n: claim.nonce })).toString("base64url");
  return `${payload}.${sign(payload)}`;
}

export function unsubscribeUrl(claim: UnsubscribeClaim, origin = appOrigin()): string {
  return `${origin}/digest/unsubscribe?token=${unsubscribeToken(claim)}`;
}

/** The one-click endpoint mail programs call (RFC 8058 List-Unsubscribe-Post). */
export function oneClickUnsubscribeUrl(claim: UnsubscribeClaim, origin = appOrigin()): string {
  return `${origin}/api/digest/unsubscribe?token=${unsubscribeToken(claim)}`;
}

/** The claim of a genuine token; null for anything altered, truncated or signed with another key. */
export function verifyUnsubscribe(token: string | null | undefined): UnsubscribeClaim | null {
  if (!token || token.length > 2000) return null;
  const [payload, signature, extra] = token.split(".");
  if (!payload || !signature || extra !== undefined) return null;
  const expected = Buffer.from(sign(payload));
  const given = Buffer.from(signature);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  try {
    const parsed = payloadSchema.safeParse(JSON.parse(Buffer.from(payload, "base64url").toString("utf8")));
    return parsed.success ? { recipientId: parsed.data.r, projectId: parsed.data.p, email: parsed.data.e, nonce: parsed.data.n } : null;
  } catch {
    return null;
  }
}
