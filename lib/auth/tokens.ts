import { createHash, randomBytes } from "node:crypto";

/** A URL-safe random token and the SHA-256 hex digest stored in its place. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");
