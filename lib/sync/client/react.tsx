"use client";

// React bindings of the device store: the provider that opens the signed-in user's database and runs
// the sync loop, hooks for the screens and the status control, and the identity helpers.
import { useLiveQuery } from "dexie-react-hooks";
import { useSession } from "next-auth/react";
import { createContext, useCallback, useContext, useEffect, useMemo, useSyncExternalStore } from "react";
import { getDeviceDb, getUserDb, type DeviceIdentity, type StoredIdentity, type SyncDb } from "./db";
import { SyncDriver, type DriverStatus } from "./driver";
import { initialStatus } from "./driver-env";
import { rememberDevicePolicy } from "./device-policy";
import { readCurrentIdentity, rememberIdentity } from "./identity";
import { readSyncSummary, type SyncSummary } from "./queries";
import { signOutWithCheck, type SignOutCheckOptions } from "./sign-out";
import { PhotoUploader } from "@/lib/photos/client/uploader";

export { rememberIdentity, signOutWithCheck, type SignOutCheckOptions };

type SyncContextValue = { db: SyncDb; driver: SyncDriver; uploader: PhotoUploader; identity: DeviceIdentity };

const SyncContext = createContext<SyncContextValue | null>(null);

/**
 * Opens the database of `identity` and runs its sync loop while mounted. With no identity it renders
 * its children without sync (the status control then shows only online/offline).
 * `source`: "session" (default) when the identity comes from an authenticated session: it is then
 * remembered on the device; "device" when it was read back offline (useOfflineIdentity).
 */
export function SyncProvider({
  identity,
  source = "session",
  children,
}: {
  identity: DeviceIdentity | null;
  source?: "session" | "device";
  children: React.ReactNode;
}) {
  const userId = identity?.id ?? null;
  const db = useMemo(() => (userId ? getUserDb(userId) : null), [userId]);
  const driver = useMemo(() => (db ? new SyncDriver({ db }) : null), [db]);
  // The photo lane runs beside the sync loop, in the leading tab, after each cycle (lib/photos/client).
  const uploader = useMemo(() => (db ? new PhotoUploader({ db }) : null), [db]);
  useEffect(() => (driver && uploader ? uploader.attach(driver) : undefined), [driver, uploader]);
  const name = identity?.name;
  const email = identity?.email;
  const isAdmin = identity?.isAdmin;

  useEffect(() => {
    if (!driver || !userId) return;
    let cancelled = false;
    const remembered =
      source === "session" && name !== undefined && email !== undefined
        ? rememberIdentity({ id: userId, name, email, isAdmin: Boolean(isAdmin) }).catch((error: unknown) =>
            console.warn("sync: could not remember the identity", error),
          )
        : Promise.resolve();
    void remembered.then(() => {
      if (!cancelled) driver.start();
    });
    return () => {
      cancelled = true;
      driver.stop();
    };
  }, [driver, userId, source, name, email, isAdmin]);

  const value = useMemo(
    () =>
      db && driver && uploader && userId
        ? { db, driver, uploader, identity: { id: userId, name: name ?? "", email: email ?? "", isAdmin: Boolean(isAdmin) } }
        : null,
    [db, driver, uploader, userId, name, email, isAdmin],
  );
  return <SyncContext.Provider value={value}>{children}</SyncContext.Provider>;
}

/** The signed-in user's database, for useLiveQuery and the write functions. Throws outside SyncProvider. */
export function useSyncDb(): SyncDb {
  const context = useContext(SyncContext);
  if (!context) throw new Error("useSyncDb needs a <SyncProvider> with a signed-in identity above it");
  return context.db;
}

/** The database, or null where no SyncProvider (or no identity) is above. */
export function useOptionalSyncDb(): SyncDb | null {
  return useContext(SyncContext)?.db ?? null;
}

/** The identity the provider runs for, or null. */
export function useSyncIdentity(): DeviceIdentity | null {
  return useContext(SyncContext)?.identity ?? null;
}

const NO_PROGRESS: ReadonlyMap<string, number> = new Map();

/** Upload progress (0–1) of the photos uploading in this tab, by photo id. */
export function usePhotoProgress(): ReadonlyMap<string, number> {
  const uploader = useContext(SyncContext)?.uploader ?? null;
  return useSyncExternalStore(uploader?.subscribe ?? noSubscribe, uploader?.getProgress ?? (() => NO_PROGRESS), () => NO_PROGRESS);
}

/** Asks for a sync now ("Sync now" buttons). No-op without a provider. */
export function useRequestSync(): () => void {
  const driver = useContext(SyncContext)?.driver ?? null;
  return useCallback(() => driver?.syncNow(), [driver]);
}

function subscribeOnline(callback: () => void) {
  window.addEventListener("online", callback);
  window.addEventListener("offline", callback);
  return () => {
    window.removeEventListener("online", callback);
    window.removeEventListener("offline", callback);
  };
}

/** navigator.onLine as React state (true during server rendering). */
export function useOnline(): boolean {
  return useSyncExternalStore(subscribeOnline, () => navigator.onLine, () => true);
}

export type SyncState = SyncSummary & {
  /** False where no SyncProvider is above (only `online` is meaningful then). */
  available: boolean;
  online: boolean;
  syncing: boolean;
  /** This tab runs the loop (the others follow its broadcasts). */
  leader: boolean;
  /** The server said 401: sync waits for the person to sign in again. */
  needsSignIn: boolean;
  storageWarning: string | null;
  persisted: boolean | null;
  /** True until the counts have been read from the database once. */
  loading: boolean;
};

const EMPTY_SUMMARY: SyncSummary = { waiting: 0, failed: 0, conflicts: 0, rejected: 0, photosWaiting: 0, photosFailed: 0, lastSyncAt: null, lastError: null };
const IDLE_STATUS: DriverStatus = initialStatus(true);
const noSubscribe = () => () => {};
const idleStatus = () => IDLE_STATUS;

/** Waiting changes, failures, conflicts, last sync and errors in words, online, syncing. */
export function useSyncState(): SyncState {
  const context = useContext(SyncContext);
  const db = context?.db ?? null;
  const driver = context?.driver ?? null;
  const online = useOnline();
  const status = useSyncExternalStore(driver?.subscribe ?? noSubscribe, driver?.getStatus ?? idleStatus, idleStatus);
  const summary = useLiveQuery(() => (db ? readSyncSummary(db) : EMPTY_SUMMARY), [db]);
  return {
    ...(summary ?? EMPTY_SUMMARY),
    // The driver's words are fresher in this tab; the stored ones come from the leading tab.
    lastError: status.lastError ?? summary?.lastError ?? null,
    available: !!context,
    online,
    syncing: status.syncing,
    leader: status.leader,
    needsSignIn: status.needsSignIn,
    storageWarning: status.storageWarning,
    persisted: status.persisted,
    loading: !!context && summary === undefined,
  };
}

export type OfflineIdentity = {
  identity: DeviceIdentity | null;
  /** "session": from next-auth; "device": remembered on this device (offline or session unknown). */
  source: "session" | "device" | null;
  /** True while neither the session nor the device database has answered. */
  loading: boolean;
  /** The device's row for the identity (offline window, PIN), when it was read from the device. */
  stored: StoredIdentity | null;
};

/**
 * The person using the app: the session's user when next-auth says authenticated (and then it is
 * remembered on the device), otherwise the last person remembered on this device. "unauthenticated"
 * never clears it: that is also what an unreachable /api/auth/session looks like. Only
 * signOutWithCheck() forgets it.
 */
export function useOfflineIdentity(): OfflineIdentity {
  const { data, status } = useSession();
  const sessionUser = status === "authenticated" && data?.user ? data.user : null;
  const sessionId = sessionUser?.id;
  const sessionName = sessionUser?.name;
  const sessionEmail = sessionUser?.email;
  const sessionAdmin = sessionUser?.isAdmin;

  useEffect(() => {
    if (!sessionId || sessionName === undefined || sessionEmail === undefined) return;
    rememberIdentity({ id: sessionId, name: sessionName, email: sessionEmail, isAdmin: Boolean(sessionAdmin) })
      .then(() => rememberDevicePolicy(sessionId))
      .catch((error: unknown) => console.warn("sync: could not remember the identity", error));
  }, [sessionId, sessionName, sessionEmail, sessionAdmin]);

  const stored = useLiveQuery<StoredIdentity | null>(() => readCurrentIdentity(getDeviceDb()), []);
  const sessionIdentity = useMemo<DeviceIdentity | null>(
    () =>
      sessionId && sessionName !== undefined && sessionEmail !== undefined
        ? { id: sessionId, name: sessionName, email: sessionEmail, isAdmin: Boolean(sessionAdmin) }
        : null,
    [sessionId, sessionName, sessionEmail, sessionAdmin],
  );
  const storedIdentity = useMemo<DeviceIdentity | null>(
    () => (stored ? { id: stored.id, name: stored.name, email: stored.email, isAdmin: stored.isAdmin } : null),
    [stored],
  );

  if (sessionIdentity) return { identity: sessionIdentity, source: "session", loading: false, stored: null };
  if (storedIdentity) return { identity: storedIdentity, source: "device", loading: false, stored: stored ?? null };
  return { identity: null, source: null, loading: stored === undefined || status === "loading", stored: null };
}

/** signOutWithCheck bound to the provider's user (for a "Sign out" menu item). */
export function useSignOutWithCheck(): (options?: Omit<SignOutCheckOptions, "userId">) => Promise<boolean> {
  const userId = useContext(SyncContext)?.identity.id;
  return useCallback((options = {}) => signOutWithCheck({ ...options, userId }), [userId]);
}
