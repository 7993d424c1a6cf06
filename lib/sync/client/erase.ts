// "Sign out and erase this device": what would be lost, then the erase and the sign-out.
import { getSession, signOut } from "next-auth/react";
import { getUserDb } from "./db";
import { eraseUserFromDevice } from "./device-access";
import { readSyncSummary } from "./queries";

export type Unsent = { changes: number; photos: number };

export async function readUnsent(userId: string): Promise<Unsent> {
  const summary = await readSyncSummary(getUserDb(userId));
  return { changes: summary.waiting, photos: summary.photosWaiting };
}

export function unsentWarning({ changes, photos }: Unsent): string | null {
  const parts = [
    changes ? `${changes} ${changes === 1 ? "change" : "changes"}` : null,
    photos ? `${photos} ${photos === 1 ? "photo" : "photos"}` : null,
  ].filter(Boolean);
  if (!parts.length) return null;
  return `${parts.join(" and ")} ${changes + photos === 1 ? "has" : "have"} not reached the server yet. Erasing this device loses ${changes + photos === 1 ? "it" : "them"} for good.`;
}

const PENDING_SIGN_OUT = "pw-sign-out-pending";

/**
 * Erases the person's data from this device, then signs out. Offline the sign-out cannot reach the
 * server: it is remembered and finished on the next page opened online (finishPendingSignOut).
 */
export async function eraseAndSignOut(userId: string): Promise<void> {
  await eraseUserFromDevice(userId);
  try {
    await signOut({ callbackUrl: "/signin" });
  } catch {
    try {
      localStorage.setItem(PENDING_SIGN_OUT, userId);
    } catch {
      /* nothing to remember it in */
    }
    // A full load on purpose: it drops every in-memory copy of the erased data.
    // eslint-disable-next-line @next/next/no-location-assign-relative-destination
    window.location.assign("/signin");
  }
}

/**
 * Completes a sign-out that an offline erase could not send, if the browser is still signed in as
 * that person (someone who signed in since is left alone).
 */
export async function finishPendingSignOut(): Promise<void> {
  try {
    const pendingUserId = localStorage.getItem(PENDING_SIGN_OUT);
    if (!pendingUserId || !navigator.onLine) return;
    const session = await getSession();
    localStorage.removeItem(PENDING_SIGN_OUT);
    if (session?.user?.id === pendingUserId) await signOut({ callbackUrl: "/signin" });
  } catch {
    /* tried again on the next page */
  }
}
