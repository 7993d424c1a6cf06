// The device database ("placewright-device"): who signed in last on this device, so the field can
// open offline (STACK.md, identity offline). One per device, shared by every user of it.
import Dexie, { type Table } from "dexie";

export const DEVICE_DB_NAME = "placewright-device";

export type DeviceIdentity = { id: string; name: string; email: string; isAdmin: boolean };
/** A device PIN: PBKDF2-SHA-256 of the PIN with a random salt (base64), never the PIN itself. */
export type StoredPin = { salt: string; hash: string; iterations: number; failures: number };
/**
 * `sessionSeenAt`: the last time the server confirmed a good session for this person on this device;
 * with `offlineWindowHours` (the administrator's setting, fetched while online) it decides whether the
 * person's offline data opens without the PIN (lib/sync/client/device-access.ts). Fields added without
 * a schema change: none of them is indexed.
 */
export type StoredIdentity = DeviceIdentity & {
  rememberedAt: string;
  sessionSeenAt?: string;
  offlineWindowHours?: number;
  pin?: StoredPin;
};
type DeviceRow = { key: "currentUserId"; value: string | null };

export class DeviceDb extends Dexie {
  declare identities: Table<StoredIdentity, string>;
  declare device: Table<DeviceRow, string>;

  constructor(options?: ConstructorParameters<typeof Dexie>[1]) {
    super(DEVICE_DB_NAME, options);
    this.version(1).stores({ identities: "id", device: "key" });
  }
}

let deviceDb: DeviceDb | null = null;
export function getDeviceDb(): DeviceDb {
  deviceDb ??= new DeviceDb();
  return deviceDb;
}
