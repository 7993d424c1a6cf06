// Who may open a person's offline data on a shared device. Offline, the server cannot be asked, so
// the device decides: the person's data opens when their session was confirmed good within the
// offline window (set by an administrator, default DEFAULT_OFFLINE_WINDOW_HOURS), or after they type
// the device PIN they chose while online. Otherwise the field screens ask to sign in and show nothing
// of theirs. "Sign out and erase" removes everything of the person from the device.
import Dexie from "dexie";
import { getDeviceDb, releaseUserDb, userDbName, type DeviceDb, type StoredIdentity, type StoredPin } from "./db";

/** Used until the device has fetched the administrator's setting (same as the server's default). */
export const FALLBACK_OFFLINE_WINDOW_HOURS = 72;
export const PIN_PATTERN = /^\d{4,8}$/;
export const PIN_MAX_FAILURES = 5;
const PIN_ITERATIONS = 210_000; // OWASP Password Storage Cheat Sheet, PBKDF2-HMAC-SHA256 [common practice]

export type OfflineAccess = "open" | "pin" | "signin";

/** Pure: may this remembered identity open offline now? `unlocked`: the PIN was typed in this tab. */
export function offlineAccess(identity: Pick<StoredIdentity, "sessionSeenAt" | "offlineWindowHours" | "pin">, now: Date, unlocked: boolean): OfflineAccess {
  const windowMs = (identity.offlineWindowHours ?? FALLBACK_OFFLINE_WINDOW_HOURS) * 3_600_000;
  const seen = identity.sessionSeenAt ? Date.parse(identity.sessionSeenAt) : NaN;
  if (Number.isFinite(seen) && now.getTime() - seen <= windowMs && seen <= now.getTime() + 60_000) return "open";
  if (identity.pin && unlocked) return "open";
  return identity.pin ? "pin" : "signin";
}

const b64 = (bytes: ArrayBuffer | Uint8Array) => btoa(String.fromCharCode(...new Uint8Array(bytes)));
const unb64 = (text: string) => Uint8Array.from(atob(text), (c) => c.charCodeAt(0));

async function pinHash(pin: string, salt: Uint8Array, iterations: number): Promise<string> {
  const key = await crypto.subtle.importKey("raw", new TextEncoder().encode(pin), "PBKDF2", false, ["deriveBits"]);
  const bits = await crypto.subtle.deriveBits({ name: "PBKDF2", hash: "SHA-256", salt: salt as BufferSource, iterations }, key, 256);
  return b64(bits);
}

/** Sets (or replaces) the person's device PIN. Only while their session is good (the caller checks online). */
export async function setDevicePin(userId: string, pin: string, deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  if (!PIN_PATTERN.test(pin)) throw new Error("Use 4 to 8 digits for the PIN.");
  const salt = crypto.getRandomValues(new Uint8Array(16));
  const stored: StoredPin = { salt: b64(salt), hash: await pinHash(pin, salt, PIN_ITERATIONS), iterations: PIN_ITERATIONS, failures: 0 };
  const updated = await deviceDb.identities.update(userId, { pin: stored });
  if (!updated) throw new Error("Open the field screens once while signed in, then set the PIN.");
}

export async function removeDevicePin(userId: string, deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  await deviceDb.identities.where("id").equals(userId).modify((row) => void delete row.pin);
}

export type PinCheck = { ok: true } | { ok: false; message: string; locked: boolean };

/** Checks a typed PIN; after PIN_MAX_FAILURES wrong ones the PIN is removed and only a sign-in opens the data. */
export async function checkDevicePin(userId: string, pin: string, deviceDb: DeviceDb = getDeviceDb()): Promise<PinCheck> {
  const identity = await deviceDb.identities.get(userId);
  if (!identity?.pin) return { ok: false, message: "No PIN is set on this device. Sign in with a connection.", locked: true };
  const { salt, hash, iterations, failures } = identity.pin;
  if (PIN_PATTERN.test(pin) && (await pinHash(pin, unb64(salt), iterations)) === hash) {
    await deviceDb.identities.update(userId, { pin: { ...identity.pin, failures: 0 } });
    return { ok: true };
  }
  if (failures + 1 >= PIN_MAX_FAILURES) {
    await removeDevicePin(userId, deviceDb);
    return { ok: false, message: "Too many wrong PINs. The PIN is removed: sign in with a connection to open your data.", locked: true };
  }
  await deviceDb.identities.update(userId, { pin: { ...identity.pin, failures: failures + 1 } });
  const left = PIN_MAX_FAILURES - failures - 1;
  return { ok: false, message: `That PIN is not right. ${left} ${left === 1 ? "try" : "tries"} left.`, locked: false };
}

/** Stores the administrator's offline window on the person's identity (fetched while online). */
export async function rememberOfflineWindow(userId: string, hours: number, deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  await deviceDb.identities.update(userId, { offlineWindowHours: hours });
}

// The PIN unlock lasts for this tab only (sessionStorage), never across a closed browser.
const unlockKey = (userId: string) => `pw-unlocked-${userId}`;
export function isUnlockedInTab(userId: string): boolean {
  try {
    return sessionStorage.getItem(unlockKey(userId)) === "1";
  } catch {
    return false;
  }
}
export function markUnlockedInTab(userId: string, unlocked: boolean): void {
  try {
    if (unlocked) sessionStorage.setItem(unlockKey(userId), "1");
    else sessionStorage.removeItem(unlockKey(userId));
  } catch {
    /* private mode: the PIN is asked again */
  }
}

/**
 * Removes everything of the person from this device: their database (records, outbox, photos,
 * conflicts), their remembered identity and PIN, and the device's "current user" if it was them.
 */
export async function eraseUserFromDevice(userId: string, deviceDb: DeviceDb = getDeviceDb()): Promise<void> {
  releaseUserDb(userId);
  await Dexie.delete(userDbName(userId));
  await deviceDb.transaction("rw", deviceDb.identities, deviceDb.device, async () => {
    await deviceDb.identities.delete(userId);
    const current = await deviceDb.device.get("currentUserId");
    if (current?.value === userId) await deviceDb.device.put({ key: "currentUserId", value: null });
  });
  markUnlockedInTab(userId, false);
  try {
    localStorage.removeItem("pw-field-project");
  } catch {
    /* nothing kept */
  }
}
