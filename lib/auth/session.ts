import type { NextRequest } from "next/server";
import { getServerSession } from "next-auth";
import { getToken } from "next-auth/jwt";
import { config } from "@/lib/config";
import { unauthenticated } from "@/lib/errors";
import { findUserById } from "@/lib/users/queries";
import { authOptions, type SessionUser } from "./options";

/**
 * The signed-in user, re-read from the database so a disabled account or a changed admin flag
 * takes effect at once (the JWT only proves who it is). Route handlers pass their request, so the
 * session cookie is read from it directly; pages and server actions use the request scope.
 */
export async function getSessionUser(req?: NextRequest): Promise<SessionUser | null> {
  const id = req
    ? (await getToken({ req, secret: config().auth.secret }))?.sub
    : (await getServerSession(authOptions))?.user?.id;
  if (!id) return null;
  const user = await findUserById(id);
  if (!user || user.disabledAt) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

export async function requireUser(req?: NextRequest): Promise<SessionUser> {
  const user = await getSessionUser(req);
  if (!user) throw unauthenticated();
  return user;
}
