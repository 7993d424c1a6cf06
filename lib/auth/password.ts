import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (OWASP-recommended memory and time costs).
export const hashPassword = (password: string) => hash(password);

// Checked when there is no account or no password, so the answer takes as long as a real check.
let dummyHash: Promise<string> | undefined;

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (!passwordHash) {
    dummyHash ??= hash(`no account ${Math.random()}`);
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
