import { getServerSession } from "next-auth";
import { unauthenticated } from "@/lib/errors";
import { findUserById } from "@/lib/users/queries";
import { authOptions, type SessionUser } from "./options";

/**
 * The signed-in user, re-read from the database so a disabled account or a changed admin flag
 * takes effect at once (the JWT only proves who it is).
 */
export async function getSessionUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const user = await findUserById(id);
  if (!user || user.disabledAt) return null;
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

export async function requireUser(): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) throw unauthenticated();
  return user;
}
