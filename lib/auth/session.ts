import type { NextRequest } from "next/server";
import { redirect } from "next/navigation";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import { config } from "@/lib/config";
import { unauthenticated } from "@/lib/errors";
import { authOptions, type SessionUser } from "./options";
import { userOfLiveSession } from "./user-sessions";

/**
 * The signed-in user, re-read from the database on every request so a disabled account, a revoked
 * or idle session, or a changed admin flag takes effect at once (the JWT only names the user and
 * the session row: lib/auth/user-sessions.ts). Route handlers pass their request, so the session
 * cookie is read from it directly; pages and server actions use the request scope.
 */
export async function getSessionUser(req?: NextRequest): Promise<SessionUser | null> {
  let id: string | undefined;
  let sessionId: string | undefined;
  if (req) {
    const token = await getToken({ req, secret: config().auth.secret });
    [id, sessionId] = [token?.sub, token?.sid];
  } else {
    const user = (await getServerSession(authOptions))?.user;
    [id, sessionId] = [user?.id, user?.sid];
  }
  if (!id || !sessionId) return null;
  const user = await userOfLiveSession(sessionId, id);
  if (!user) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, sessionId };
}

/** The signed-in user; a route handler answers 401 without one, a page goes to the sign-in screen. */
export async function requireUser(req?: NextRequest): Promise<SessionUser> {
  const user = await getSessionUser(req);
  if (!user) {
    // A page rendered beside the layout's own check (revoked or idle session) must not show an error.
    if (!req) redirect("/signin");
    throw unauthenticated();
  }
  return user;
}
