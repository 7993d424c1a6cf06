// Shared fixtures for the device sync tests (fake-indexeddb is loaded by each test file first).
import { ensureMeta, releaseUserDb, getUserDb, type LocalRecord, type SyncDb } from "@/lib/sync/client/db";
import { SYNC_SCHEMA_VERSION, type SyncProject } from "@/lib/sync/protocol";

export const PROJECT_ID = "11111111-1111-4111-8111-111111111111";
export const OTHER_PROJECT_ID = "22222222-2222-4222-8222-222222222222";

export const project = (id = PROJECT_ID, role: SyncProject["role"] = "superintendent"): SyncProject => ({
  id,
  name: "Tower B",
  code: "TB",
  role,
  unitSystem: "SI",
  timeZone: "America/Chicago",
});

let counter = 0;
const opened: string[] = [];

/** A fresh, empty database for a new user id. */
export async function freshDb(prefix = "user"): Promise<SyncDb> {
  counter += 1;
  const userId = `${prefix}-${counter}-${crypto.randomUUID()}`;
  const db = getUserDb(userId);
  opened.push(userId);
  await ensureMeta(db, SYNC_SCHEMA_VERSION);
  return db;
}

/** Closes and deletes the databases opened by freshDb. */
export async function cleanupDbs(): Promise<void> {
  for (const userId of opened.splice(0)) {
    const db = getUserDb(userId);
    releaseUserDb(userId);
    await db.delete().catch(() => undefined);
  }
}

export const placementValues = (overrides: Record<string, unknown> = {}) => ({
  element: "Level 3 slab, pour 2",
  elementType: "elevated-slab",
  plannedStart: "2026-11-09T07:00:00-06:00",
  plannedVolumeM3: 85,
  ...overrides,
});

export const crewValues = (diaryEntryId: string, overrides: Record<string, unknown> = {}) => ({
  diaryEntryId,
  trade: "Finishers",
  count: 6,
  ...overrides,
});

/** The fields a person entered (sync bookkeeping left out), for comparing copies. */
export function domainFields(row: Record<string, unknown> | undefined, keys: readonly string[]): Record<string, unknown> | undefined {
  if (!row) return undefined;
  return Object.fromEntries(keys.map((k) => [k, row[k] ?? null]));
}

export function visible(row: LocalRecord | undefined) {
  return row && !row.deletedAt ? row : undefined;
}
