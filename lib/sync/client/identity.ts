// Who is signed in on this device, kept in the device database so the field screens can show the
// person's name and open their database when /api/auth/session cannot be reached (STACK.md
// "Identity offline"). Remembered whenever the session is authenticated; cleared only by an explicit
// sign-out, never because the session looks "unauthenticated" (that is also what a lost network
// looks like).
import { getDeviceDb, type DeviceDb, type DeviceIdentity, type StoredIdentity } from "./db";

export type { DeviceIdentity, StoredIdentity };

/** Stores the signed-in person (their session is good now) and makes them the device's current user. */
export async function rememberIdentity(user: DeviceIdentity, deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  const now = new Date().toISOString();
  await deviceDb.transaction("rw", deviceDb.identities, deviceDb.device, async () => {
    // Keep the device PIN and the offline window; a good session also counts as "seen now".
    const before = await deviceDb.identities.get(user.id);
    const identity: StoredIdentity = {
      ...before,
      id: user.id,
      name: user.name,
      email: user.email,
      isAdmin: Boolean(user.isAdmin),
      rememberedAt: now,
      sessionSeenAt: now,
    };
    await deviceDb.identities.put(identity);
    await deviceDb.device.put({ key: "currentUserId", value: user.id });
  });
}

/** The person last signed in on this device (null after a sign-out or before any sign-in). */
export async function readCurrentIdentity(deviceDb: DeviceDb = getDeviceDb()): Promise<StoredIdentity | null> {
  return deviceDb.transaction("r", deviceDb.identities, deviceDb.device, async () => {
    const current = await deviceDb.device.get("currentUserId");
    if (!current?.value) return null;
    return (await deviceDb.identities.get(current.value)) ?? null;
  });
}

/**
 * Explicit sign-out: nobody is current any more. The person's identity row and their database stay
 * (their unsent changes are sent at their next sign-in); another person signing in opens their own.
 */
export async function forgetCurrentIdentity(deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  await deviceDb.device.put({ key: "currentUserId", value: null });
}

/** Whether `userId` is the device's current user (the driver syncs only for them). */
export async function isCurrentIdentity(userId: string): Promise<boolean> {
  const current = await readCurrentIdentity(getDeviceDb());
  return current?.id === userId;
}
