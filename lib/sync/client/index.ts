// The device side of offline sync (no React here; the hooks and SyncProvider are in ./react).
export {
  getUserDb,
  getDeviceDb,
  userDbName,
  ensureMeta,
  getMeta,
  SyncDb,
  type LocalRecord,
  type OutboxEntry,
  type OutboxState,
  type ConflictRow,
  type ProjectRow,
  type BlobRow,
  type DeviceIdentity,
} from "./db";
export { createLocal, updateLocal, deleteLocal, transitionLocal, resolveConflictLocal, newRecordId, transitionArgsSchema, type WriteResult } from "./mutate";
export { transitionSiteRecordLocal } from "./site-visits";
export { LocalWriteError, LocalValidationError, isLocalWriteError, type LocalErrorCode } from "./errors";
export { getRecord, listByProject, listByParent, listProjects, listOutbox, listConflicts, dismissRejection, readSyncSummary, countUnsynced, type SyncSummary } from "./queries";
export { LOCAL_TYPES, LOCAL_RECORD_TYPES, tableNameOf, localDef, isLocalRecordType, type RecordType, type ParentField } from "./record-types";
export { rememberIdentity, readCurrentIdentity, forgetCurrentIdentity } from "./identity";
export { SyncDriver, lockName, type DriverStatus } from "./driver";
export { applyPull } from "./apply-pull";
export { pushOnce, pushAll } from "./push";
export { pullOnce, pullAll } from "./pull";
