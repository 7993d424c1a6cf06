// Signing out on a device that may hold changes the server has not seen yet.
import { signOut } from "next-auth/react";
import { getUserDb } from "./db";
import { forgetCurrentIdentity, readCurrentIdentity } from "./identity";
import { countUnsynced } from "./queries";
import { unsyncedWarning } from "./words";

export type SignOutCheckOptions = {
  /** Whose changes to count; default the device's current user. */
  userId?: string;
  /** Asks the person; default window.confirm. Return false to stay signed in. */
  confirm?: (message: string) => boolean | Promise<boolean>;
  callbackUrl?: string;
  /** Default next-auth's signOut (injected in tests). */
  signOut?: (options: { callbackUrl: string }) => Promise<unknown>;
};

/**
 * Signs out, first saying so when this user has changes that have not reached the server
 * ("3 changes have not reached the server yet. They stay on this device and will be sent the next
 * time you sign in."). The user's database is kept (it is per user); only the device's "current user"
 * is forgotten. Resolves false when the person chose to stay.
 */
export async function signOutWithCheck(options: SignOutCheckOptions = {}): Promise<boolean> {
  const userId = options.userId ?? (await readCurrentIdentity().catch(() => null))?.id;
  if (userId) {
    const waiting = await countUnsynced(getUserDb(userId)).catch(() => 0);
    if (waiting > 0) {
      const ask = options.confirm ?? ((message: string) => window.confirm(message));
      if (!(await ask(unsyncedWarning(waiting)))) return false;
    }
  }
  await forgetCurrentIdentity().catch((error: unknown) => console.warn("sync: could not forget the identity", error));
  await (options.signOut ?? ((o) => signOut(o)))({ callbackUrl: options.callbackUrl ?? "/signin" });
  return true;
}
