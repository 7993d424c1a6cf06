import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (OWASP-recommended memory and time costs).
export const hashPassword = (password: string) => hash(password);

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (!passwordHash) return false;
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
