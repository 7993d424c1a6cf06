// The device's IndexedDB, one database per signed-in user ("placewright-user-<userId>"), so a second
// person signing in on the same device never sees or sends the first person's changes; plus one small
// device-level database ("placewright-device", ./device-db.ts) with the last signed-in identities.
//
// Rows of the record tables are the server's fields (as JSON: dates as ISO strings) with two more:
// - `pending`: 1 while a local change to the row waits in the outbox (indexable, so not a boolean);
// - `serverCopy`: the row as the server last sent it (null for a row created here and not yet pulled).
//   The visible row is always `serverCopy` with the outbox entries for the record re-applied on top, so
//   a pull or a refused change can rebuild it exactly (lib/sync/client/replay.ts).
// Tombstones (`deletedAt` set) are kept as rows; screens read through lib/sync/client/queries.ts,
// which leaves them out.
import Dexie, { type Table } from "dexie";
import type { ConflictSummary, Cursor, MutationName, SyncProject } from "@/lib/sync/protocol";
import type { LocalRecord } from "./local-record";
import { LOCAL_RECORD_TYPES, storeSpec, tableNameOf, type RecordType } from "./record-types";

export { DEVICE_DB_NAME, DeviceDb, getDeviceDb, type DeviceIdentity, type StoredIdentity, type StoredPin } from "./device-db";

export const USER_DB_PREFIX = "placewright-user-";

export type { LocalFields, LocalRecord, LocalRecordBase } from "./local-record";

export type OutboxState = "pending" | "sending" | "failed";

/**
 * One local change waiting for the server. `mutationId` is unique and increases by one per change on
 * this device (and user). `baseVersion` is left empty on a change that follows another outstanding
 * change to the same record: it is filled in from that change's answer before it is sent (push.ts).
 */
export type OutboxEntry = {
  seq?: number;
  mutationId: number;
  name: MutationName;
  recordType: RecordType;
  projectId: string;
  recordId: string;
  args: Record<string, unknown>;
  baseVersion?: number;
  attempts: number;
  lastError: string | null;
  lastAttemptAt: string | null;
  createdAt: string;
  state: OutboxState;
};

/**
 * A conflict (as the server reports it on pull, or as a push answered it) or a refused change.
 * Server conflicts are replaced on every pull; refused changes stay until the person dismisses them.
 */
export type ConflictRow = ConflictSummary & {
  kind: "conflict" | "rejected";
  source: "push" | "server";
  message?: string;
  mutationId?: number;
  mutationName?: MutationName;
};

export type ProjectRow = SyncProject;

export type BlobUploadState = "queued" | "uploading" | "stored" | "failed";
/**
 * A photo's bytes on this device (id = the photo's id). `data` is the compressed photo that is
 * uploaded; it is dropped (null) once a pull shows the photo stored. `thumb` stays for offline viewing.
 */
export type BlobRow = {
  id: string;
  projectId?: string;
  recordId?: string;
  data: Blob | ArrayBuffer | null;
  thumb?: Blob | ArrayBuffer | null;
  /** When the next upload attempt is due (ms since epoch), after a failure. */
  nextAttemptAt?: number | null;
  sha256: string;
  contentType: string;
  size: number;
  uploadState: BlobUploadState;
  attempts: number;
  lastError?: string | null;
  createdAt: string;
};

export type MetaValues = {
  userId: string;
  clientId: string;
  nextMutationId: number;
  cursor: Cursor | null;
  schemaVersion: number;
  /** The server's watermark for this client as last reported. */
  lastMutationId: number;
  lastSyncAt: string | null;
  lastError: string | null;
  persistRequested: boolean;
};
export type MetaKey = keyof MetaValues;
export type MetaRow = { key: MetaKey; value: MetaValues[MetaKey] };

type LocalWriteListener = () => void;

export class SyncDb extends Dexie {
  declare outbox: Table<OutboxEntry, number>;
  declare meta: Table<MetaRow, MetaKey>;
  declare conflicts: Table<ConflictRow, string>;
  declare projects: Table<ProjectRow, string>;
  declare blobs: Table<BlobRow, string>;

  readonly userId: string;
  private readonly localWriteListeners = new Set<LocalWriteListener>();

  constructor(userId: string, options?: ConstructorParameters<typeof Dexie>[1]) {
    super(userDbName(userId), options);
    this.userId = userId;
    const stores: Record<string, string> = {
      outbox: "++seq, &mutationId, [recordType+recordId], state, projectId",
      meta: "key",
      conflicts: "id, kind, projectId, [recordType+recordId]",
      projects: "id",
      blobs: "id, uploadState, recordId",
    };
    const later: RecordType[] = ["photos", "site-visits", "findings", "temperature-sensors", "sensor-readings"];
    for (const type of LOCAL_RECORD_TYPES) if (!later.includes(type)) stores[tableNameOf(type)] = storeSpec(type);
    this.version(1).stores(stores);
    // 2: photo metadata as a synced record type (the bytes stay in `blobs`).
    this.version(2).stores({ [tableNameOf("photos")]: storeSpec("photos") });
    // 3: the inspection log (site visits and their findings).
    this.version(3).stores({ [tableNameOf("site-visits")]: storeSpec("site-visits"), [tableNameOf("findings")]: storeSpec("findings") });
    // 4: temperature sensors and their reading batches (maturity method).
    this.version(4).stores({
      [tableNameOf("temperature-sensors")]: storeSpec("temperature-sensors"),
      [tableNameOf("sensor-readings")]: storeSpec("sensor-readings"),
    });
  }

  /** The table of a record type, loose rows: for the generic sync code (pull, push, replay, merge). */
  records(type: RecordType): Table<LocalRecord, string> {
    return this.table(tableNameOf(type));
  }

  /**
   * The same table with its rows typed by the type's schema, for reads on the screens. Dexie does not
   * check rows against a type, so this is where the loose row becomes the typed one; the write
   * functions (mutate.ts) validate with the same schema, and the server sends its own rows.
   */
  typedRecords<T extends RecordType>(type: T): Table<LocalRecord<T>, string> {
    return this.table(tableNameOf(type));
  }

  /** Every record table (for transactions that rebuild rows of any type). */
  recordTables(): Table<LocalRecord, string>[] {
    return LOCAL_RECORD_TYPES.map((type) => this.records(type));
  }

  /** The tables a sync transaction touches: every record table, outbox, meta, conflicts, projects. */
  syncTables(): Table[] {
    return [...this.recordTables(), this.outbox, this.meta, this.conflicts, this.projects];
  }

  /** Called by the write functions after a commit; the sync driver listens (debounced sync). */
  onLocalWrite(listener: LocalWriteListener): () => void {
    this.localWriteListeners.add(listener);
    return () => this.localWriteListeners.delete(listener);
  }

  notifyLocalWrite(): void {
    for (const listener of [...this.localWriteListeners]) listener();
  }
}

export function userDbName(userId: string): string {
  if (!userId) throw new Error("A user id is needed to open the device database");
  return `${USER_DB_PREFIX}${userId}`;
}

const openDbs = new Map<string, SyncDb>();

/**
 * The user's database (one instance per user per page, so every hook and the driver share it). It
 * opens on first use. Opening it for another user never touches this one.
 */
export function getUserDb(userId: string): SyncDb {
  // On the server (prerender, SSR) nothing is opened: no cache, so no instance outlives the request.
  if (typeof window === "undefined" && typeof indexedDB === "undefined") return new SyncDb(userId);
  let db = openDbs.get(userId);
  if (!db) {
    db = new SyncDb(userId);
    openDbs.set(userId, db);
  }
  return db;
}

/** Closes and forgets the cached instance (tests; sign-out keeps the data). */
export function releaseUserDb(userId: string): void {
  const db = openDbs.get(userId);
  if (db) {
    db.close();
    openDbs.delete(userId);
  }
}

// ---------------------------------------------------------------------------------------------
// meta

export async function getMeta<K extends MetaKey>(db: SyncDb, key: K): Promise<MetaValues[K] | undefined> {
  const row = await db.meta.get(key);
  return row?.value as MetaValues[K] | undefined;
}

export async function setMeta<K extends MetaKey>(db: SyncDb, key: K, value: MetaValues[K]): Promise<void> {
  await db.meta.put({ key, value });
}

/**
 * Makes sure the database has its identity: a client id (a UUID created once per device and user),
 * the next mutation id and the schema version. A changed local schema version drops the pull cursor,
 * so the next pull is a full reset; the outbox is kept.
 */
export async function ensureMeta(db: SyncDb, schemaVersion: number): Promise<{ clientId: string }> {
  return db.transaction("rw", db.meta, async () => {
    let clientId = await getMeta(db, "clientId");
    if (!clientId) {
      clientId = crypto.randomUUID();
      await setMeta(db, "clientId", clientId);
      await setMeta(db, "userId", db.userId);
    }
    if ((await getMeta(db, "nextMutationId")) === undefined) await setMeta(db, "nextMutationId", 1);
    const stored = await getMeta(db, "schemaVersion");
    if (stored !== schemaVersion) {
      await setMeta(db, "schemaVersion", schemaVersion);
      await setMeta(db, "cursor", null);
    }
    return { clientId };
  });
}
