// The one way the device writes a record (SYNC.md "Write rule"): validate with the shared zod schema,
// then, in ONE Dexie transaction, write the optimistic row AND its outbox entry, taking the next
// mutation id from meta inside that transaction. Invalid input throws LocalValidationError and
// writes nothing. After the commit the sync driver is asked to sync shortly (debounced).
//
// Base versions. Every change carries the version of the record the person edited, as the server last
// acknowledged it. A change that follows another change to the same record that has not been
// answered yet cannot know that version, so:
// - an update of a record whose latest waiting change is a create or an update that has never been
//   sent is MERGED into that change (into the create's values, or into the update's patch). No new
//   mutation id is used; the merged change is what the server receives. A change that has been sent
//   once is never altered (the server may have stored it already).
// - otherwise the new entry is queued without a base version; push.ts fills it in from the answer to
//   the change before it (applied → the version it produced; conflict or refused → that change's own
//   base version, so an edit built on a refused edit also conflicts instead of overwriting silently).
//   So an update sent after the create of a record made on this device carries baseVersion 1.
import { z } from "zod";
import { PHOTO_SIGNED_MESSAGE } from "@/lib/photos/rules";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { describeAllowed, describeForbidden, findTransition, rolesFor, type PlacementState } from "@/lib/placements/workflow";
import { assertVisitNotSigned } from "./visit-freeze";
import { getMeta, setMeta, type LocalRecord, type OutboxEntry, type SyncDb } from "./db";
import { LocalWriteError, validationError } from "./errors";
import { isLocalRecordType, localDef, type RecordType } from "./record-types";
import { entriesFor, rebuildRecord, toWire } from "./replay";

export type WriteResult = {
  /** The record's id (made on the device for a create). */
  id: string;
  /** The outbox entry that carries the change (an earlier one when the change was merged into it). */
  mutationId: number;
  /** True when the change was merged into a waiting create or update instead of a new entry. */
  merged: boolean;
};

/** Arguments of a placement transition (mutation "transition"). The sign-off is not a transition. */
export const transitionArgsSchema = z
  .object({
    to: z.enum(PLACEMENT_STATES, { error: `The new state must be one of: ${PLACEMENT_STATES.join(", ")}` }),
    reason: z.string({ error: "The reason must be text" }).trim().max(1_000, "The reason can be at most 1000 characters").optional(),
  })
  .superRefine((v, ctx) => {
    if (v.to === "held" && !v.reason) ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the placement is held" });
  });

/** A UUID for a record made on this device. */
export function newRecordId(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  // Insecure contexts have no randomUUID; build a version-4 UUID from random bytes.
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

function parseOrThrow<T>(schema: z.ZodType<T>, input: unknown): T {
  const result = schema.safeParse(input);
  if (!result.success) throw validationError(result.error);
  return result.data;
}

/** Takes the next mutation id and queues the entry (inside the caller's transaction). */
export async function appendEntry(
  db: SyncDb,
  entry: Pick<OutboxEntry, "name" | "recordType" | "projectId" | "recordId" | "args" | "baseVersion">,
): Promise<number> {
  const mutationId = (await getMeta(db, "nextMutationId")) ?? 1;
  await setMeta(db, "nextMutationId", mutationId + 1);
  const full: OutboxEntry = {
    ...entry,
    mutationId,
    attempts: 0,
    lastError: null,
    lastAttemptAt: null,
    createdAt: new Date().toISOString(),
    state: "pending",
  };
  if (full.baseVersion === undefined) delete full.baseVersion;
  await db.outbox.add(full);
  return mutationId;
}

/** The base version of a new change: the acknowledged version, or none when a change is still waiting. */
export function baseVersionFor(row: LocalRecord, waiting: readonly OutboxEntry[]): number | undefined {
  if (waiting.length > 0) return undefined;
  return row.version >= 1 ? row.version : undefined;
}

export async function loadLive(db: SyncDb, type: RecordType, id: string): Promise<LocalRecord> {
  const def = localDef(type);
  const row = await db.records(type).get(id);
  if (!row) throw new LocalWriteError("not_found", `${def.label} not found on this device.`);
  if (row.deletedAt) throw new LocalWriteError("deleted", `This ${def.label.toLowerCase()} was deleted.`);
  return row;
}

/** The placement whose sign-off freezes this record, if any (as lib/records/registry frozenBy). */
async function freezingPlacement(db: SyncDb, type: RecordType, values: Record<string, unknown>): Promise<LocalRecord | undefined> {
  if (type === "placements") return values as LocalRecord;
  if (type === "photos") {
    // A photo is frozen with the record it shows (an amendment's photo never is).
    const target = values.recordType;
    if (typeof target !== "string" || !isLocalRecordType(target) || typeof values.recordId !== "string") return undefined;
    const row = await db.records(target).get(values.recordId);
    return row ? freezingPlacement(db, target, row) : undefined;
  }
  if (type === "checklist-items") {
    const checklist = typeof values.checklistId === "string" ? await db.records("checklists").get(values.checklistId) : undefined;
    return typeof checklist?.placementId === "string" ? db.records("placements").get(checklist.placementId) : undefined;
  }
  const frozenByPlacement: RecordType[] = ["deliveries", "field-tests", "specimen-sets", "weather-observations", "checklists", "curing-readings"];
  if (frozenByPlacement.includes(type) && typeof values.placementId === "string") {
    return db.records("placements").get(values.placementId);
  }
  return undefined;
}

async function assertNotSigned(db: SyncDb, type: RecordType, values: Record<string, unknown>) {
  if (type === "site-visits" || type === "findings") return assertVisitNotSigned(db, type, values);
  const placement = await freezingPlacement(db, type, values);
  if (placement?.state === "signed") {
    if (type === "photos") throw new LocalWriteError("signed", PHOTO_SIGNED_MESSAGE);
    throw new LocalWriteError("signed", "This placement is signed, so its records cannot change. Ask the office for an amendment.");
  }
}

export function writeTx<T>(db: SyncDb, fn: () => Promise<T>): Promise<T> {
  return db.transaction("rw", db.syncTables(), fn);
}

/**
 * Creates a record on the device. `values` is the form's input for the type's create schema; an `id`
 * may be given (a UUID made earlier, e.g. to link children before saving), otherwise one is made.
 */
export async function createLocal(
  db: SyncDb,
  recordType: RecordType,
  projectId: string,
  values: Record<string, unknown>,
): Promise<WriteResult> {
  const def = localDef(recordType);
  const id = typeof values.id === "string" && values.id ? values.id : newRecordId();
  const args = toWire(parseOrThrow(def.create, { ...values, id }));
  if (!projectId) throw new LocalWriteError("invalid_input", "Choose a project first.", { projectId: "Choose a project first" });
  const result = await writeTx(db, async () => {
    if (await db.records(recordType).get(id)) {
      throw new LocalWriteError("state", `A ${def.label.toLowerCase()} with this id already exists on this device.`);
    }
    if (def.parentField && typeof args[def.parentField] === "string") {
      const parentType = PARENT_TYPES[def.parentField];
      const parent = await db.records(parentType).get(args[def.parentField] as string);
      if (parent?.deletedAt) throw new LocalWriteError("deleted", `The ${localDef(parentType).label.toLowerCase()} was deleted.`);
      if (parent && parent.projectId !== projectId) {
        throw new LocalWriteError("invalid_input", `The ${localDef(parentType).label.toLowerCase()} belongs to another project.`);
      }
    }
    await assertNotSigned(db, recordType, args);
    const mutationId = await appendEntry(db, { name: "create", recordType, projectId, recordId: id, args });
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}

const PARENT_TYPES: Record<NonNullable<ReturnType<typeof localDef>["parentField"]>, RecordType> = {
  placementId: "placements",
  diaryEntryId: "diary-entries",
  checklistId: "checklists",
  specimenSetId: "specimen-sets",
  siteVisitId: "site-visits",
  sensorId: "temperature-sensors",
};

/** The fields of a stored row the create schema knows (the sync bookkeeping left out). */
function recordValues(row: LocalRecord): Record<string, unknown> {
  const values: Record<string, unknown> = { ...row };
  delete values.pending;
  delete values.serverCopy;
  return values;
}

/** Changes fields of a record. `patch` is validated with the type's update schema. */
export async function updateLocal(
  db: SyncDb,
  recordType: RecordType,
  id: string,
  patch: Record<string, unknown>,
): Promise<WriteResult> {
  const def = localDef(recordType);
  const parsed = toWire(parseOrThrow(def.update, patch));
  if (Object.keys(parsed).length === 0) {
    throw new LocalWriteError("invalid_input", "Nothing to change: change at least one field.", { _: "Change at least one field" });
  }
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, recordType, id);
    await assertNotSigned(db, recordType, row);
    // The whole record must still make sense (the server checks the same after merging).
    const merged = def.create.safeParse({ ...recordValues(row), ...parsed });
    if (!merged.success) throw validationError(merged.error);

    const waiting = await entriesFor(db, recordType, id);
    const latest = waiting.at(-1);
    let mutationId: number;
    let wasMerged = false;
    if (latest && latest.state === "pending" && latest.attempts === 0 && (latest.name === "create" || latest.name === "update")) {
      latest.args =
        latest.name === "create"
          ? { ...latest.args, ...parsed }
          : { patch: { ...((latest.args.patch ?? {}) as Record<string, unknown>), ...parsed } };
      await db.outbox.put(latest);
      mutationId = latest.mutationId;
      wasMerged = true;
    } else {
      mutationId = await appendEntry(db, {
        name: "update",
        recordType,
        projectId: row.projectId,
        recordId: id,
        args: { patch: parsed },
        baseVersion: baseVersionFor(row, waiting),
      });
    }
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: wasMerged };
  });
  db.notifyLocalWrite();
  return result;
}

/** Deletes a record (a tombstone on the server; children follow their parent there). */
export async function deleteLocal(db: SyncDb, recordType: RecordType, id: string): Promise<WriteResult> {
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, recordType, id);
    await assertNotSigned(db, recordType, row);
    if (recordType === "placements" && ["placing", "placed", "signed"].includes(row.state as string)) {
      throw new LocalWriteError("state", "Concrete has been placed here, so the placement cannot be deleted; correct it instead.");
    }
    const waiting = await entriesFor(db, recordType, id);
    const mutationId = await appendEntry(db, {
      name: "delete",
      recordType,
      projectId: row.projectId,
      recordId: id,
      args: {},
      baseVersion: baseVersionFor(row, waiting),
    });
    await rebuildRecord(db, recordType, id);
    return { id, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}

/**
 * Moves a placement through its workflow (lib/placements/workflow). Refused on the device when the
 * move does not exist from the current state, or belongs to another role on the project; the server
 * checks again.
 */
export async function transitionLocal(db: SyncDb, placementId: string, to: PlacementState, reason?: string): Promise<WriteResult> {
  const args = toWire(parseOrThrow(transitionArgsSchema, { to, reason: reason || undefined }));
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, "placements", placementId);
    const from = row.state as PlacementState;
    if (from === "signed") {
      throw new LocalWriteError("signed", "This placement is signed, so it cannot change state. Ask the office for an amendment.");
    }
    if (args.to === "signed") {
      throw new LocalWriteError("state", "A placement is signed through the sign-off (typed name, signature and password), not by a state change.");
    }
    const transition = findTransition(from, args.to);
    if (!transition) throw new LocalWriteError("state", describeAllowed(from));
    const project = await db.projects.get(row.projectId);
    if (project && !rolesFor(transition).includes(project.role)) {
      throw new LocalWriteError("forbidden", describeForbidden(transition));
    }
    const waiting = await entriesFor(db, "placements", placementId);
    const mutationId = await appendEntry(db, {
      name: "transition",
      recordType: "placements",
      projectId: row.projectId,
      recordId: placementId,
      args,
      baseVersion: baseVersionFor(row, waiting),
    });
    await rebuildRecord(db, "placements", placementId);
    return { id: placementId, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}


/**
 * A person's answer to a conflict (mutation "resolve"): `patch` holds the values kept, field by field
 * (empty: keep the server's values). The server applies it onto the version the person saw
 * (`baseVersion`, default the record's version as last pulled) and closes the conflict; the conflict
 * leaves this device's list at once and does not come back with a pull while the answer waits.
 */
export async function resolveConflictLocal(
  db: SyncDb,
  conflictId: string,
  patch: Record<string, unknown> = {},
  options: { baseVersion?: number } = {},
): Promise<WriteResult> {
  const conflict = await db.conflicts.get(conflictId);
  if (!conflict) throw new LocalWriteError("not_found", "That conflict is no longer open on this device.");
  if (!isLocalRecordType(conflict.recordType)) throw new LocalWriteError("not_found", "This app version does not know that record type.");
  const recordType = conflict.recordType;
  const def = localDef(recordType);
  const parsed = Object.keys(patch).length > 0 ? toWire(parseOrThrow(def.update, patch)) : {};
  const result = await writeTx(db, async () => {
    const row = await db.records(recordType).get(conflict.recordId);
    if (Object.keys(parsed).length > 0) {
      if (!row || row.deletedAt) throw new LocalWriteError("deleted", `This ${def.label.toLowerCase()} was deleted, so no values can be kept.`);
      await assertNotSigned(db, recordType, row);
      const merged = def.create.safeParse({ ...recordValues(row), ...parsed });
      if (!merged.success) throw validationError(merged.error);
    }
    const waiting = await entriesFor(db, recordType, conflict.recordId);
    const acknowledged = row && row.version >= 1 ? row.version : (conflict.serverVersion ?? 1);
    const mutationId = await appendEntry(db, {
      name: "resolve",
      recordType,
      projectId: conflict.projectId,
      recordId: conflict.recordId,
      args: { conflictId, patch: parsed },
      baseVersion: options.baseVersion ?? (waiting.length > 0 ? undefined : acknowledged),
    });
    await db.conflicts.delete(conflictId);
    await rebuildRecord(db, recordType, conflict.recordId);
    return { id: conflict.recordId, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}
