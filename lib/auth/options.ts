import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { consumeSignInToken, findUserByEmail } from "@/lib/users/queries";
import { verifyPassword } from "./password";
import { clear, clientAddress, consume, refund } from "./rate-limit";
import { hashToken } from "./tokens";
import { openSession, revokeSession, userOfLiveSession } from "./user-sessions";

/** `sessionId`: the session row of the request (lib/auth/user-sessions.ts), when there is one. */
export type SessionUser = { id: string; email: string; name: string; isAdmin: boolean; sessionId?: string };

const passwordCredentials = z.object({
  email: z.string().trim().toLowerCase().email("Enter the e-mail address you were invited with."),
  password: z.string().min(1, "Enter your password."),
});

export const WRONG_PASSWORD = "That e-mail and password do not match. Check both, or send yourself a sign-in link.";

// next-auth passes a thrown Error's message back to the sign-in form as `error`.
export async function authorizePassword(raw: Record<string, string> | undefined, fromAddress = "unknown"): Promise<SessionUser> {
  const parsed = passwordCredentials.safeParse(raw ?? {});
  if (!parsed.success) throw new Error(parsed.error.issues[0]?.message ?? "Enter your e-mail and password.");
  const { email, password } = parsed.data;
  try {
    // Points are taken before the hash is checked and given back on success (lib/auth/rate-limit.ts).
    await consume("signInIp", fromAddress);
    await consume("signInEmail", email);
    const user = await findUserByEmail(email);
    // An unknown address costs the same hash as a known one, so timing does not tell them apart.
    const ok = await verifyPassword(user && !user.disabledAt ? user.passwordHash : null, password);
    if (!ok || !user) throw new Error(WRONG_PASSWORD);
    await Promise.all([refund("signInIp", fromAddress), clear("signInEmail", email)]);
    return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
  } catch (error) {
    if (error instanceof AppError) throw new Error(error.message);
    throw error;
  }
}

export async function authorizeLink(raw: Record<string, string> | undefined): Promise<SessionUser> {
  const token = raw?.token ?? "";
  const user = token ? await consumeSignInToken(hashToken(token)) : undefined;
  if (!user || user.disabledAt) {
    throw new Error("This sign-in link has expired or was already used. Ask for a new one.");
  }
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: "/signin" },
  providers: [
    CredentialsProvider({
      id: "password",
      name: "E-mail and password",
      credentials: { email: { type: "email" }, password: { type: "password" } },
      authorize: (credentials, req) => authorizePassword(credentials as Record<string, string>, clientAddress(req?.headers)),
    }),
    CredentialsProvider({
      id: "link",
      name: "Sign-in link",
      credentials: { token: { type: "text" } },
      authorize: (credentials) => authorizeLink(credentials as Record<string, string>),
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        const u = user as SessionUser;
        token.sid = await openSession(u.id);
        token.sub = u.id;
        token.name = u.name;
        token.email = u.email;
        token.isAdmin = u.isAdmin;
      }
      return token;
    },
    async session({ session, token }) {
      // A revoked, idle or disabled session reads as signed out in the browser too.
      if (!token.sub || !token.sid || !(await userOfLiveSession(token.sid, token.sub))) return {} as typeof session;
      session.user = {
        id: token.sub ?? "",
        email: token.email ?? "",
        name: token.name ?? "",
        isAdmin: Boolean(token.isAdmin),
        sid: token.sid,
      };
      return session;
    },
  },
  events: {
    async signOut({ token }) {
      if (token?.sid) await revokeSession(token.sid);
    },
  },
};
