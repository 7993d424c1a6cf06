// The one write path of every record (create, update, delete), used by the route handlers now and
// by the sync push later, so a change made online and one made offline follow the same rules.
// Order, in one transaction: validate → authorize → tenant-scoped lookup → state checks (signed,
// placement rules) → version → change sequence → write → audit entry.
import { and, eq, isNull } from "drizzle-orm";
import type { Executor, Transaction } from "@/db";
import { transaction } from "@/db/transaction";
import { projects } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, invalidInput } from "@/lib/errors";
import { datesAffected, refreshAfterWrite, refreshFindings } from "@/lib/findings/store";
import { derivedValues, newRowValues } from "./compute";
import { authorizeIn } from "@/lib/auth/access";
import { writeActions } from "./access";
import { nextChangeSeq } from "./change-seq";
import { mapDbError } from "./db-errors";
import { assertNotSigned, assertUuid, checkLinks, lockRecord } from "./guards";
import { childTypes, column, getRecordDef, targetingTypes, type RecordDef } from "./registry";
import type { RecordContext, RecordRow } from "./types";
import { deleteBodySchema, updateBodySchema } from "./write-bodies";

export { deleteBodySchema, updateBodySchema, type UpdateBody } from "./write-bodies";

export type UpdateOptions = {
  /**
   * For the sync push: when the device edited an older version, still apply the patch if every
   * field in it is declared mergeable for the type (registry `mergeable`). Default: refuse (409).
   */
  mergeStale?: boolean;
};

/** Runs `fn` in a transaction, or in a savepoint of ctx.tx; database errors become AppErrors. */
export async function inTransaction<T>(ctx: RecordContext, def: RecordDef | undefined, fn: (tx: Transaction) => Promise<T>): Promise<T> {
  try {
    return await transaction(fn, ctx.tx);
  } catch (error) {
    throw mapDbError(error, def);
  }
}

async function projectUnitSystem(tx: Executor, projectId: string) {
  const [project] = await tx.select({ unitSystem: projects.unitSystem }).from(projects).where(eq(projects.id, projectId));
  return project?.unitSystem ?? "SI";
}

async function computed(tx: Executor, def: RecordDef, projectId: string, values: Record<string, unknown>) {
  if (!def.compute) return {};
  return derivedValues(def, projectId, values, await projectUnitSystem(tx, projectId));
}

function sameValue(a: unknown, b: unknown): boolean {
  if (a instanceof Date || b instanceof Date) {
    return a != null && b != null && new Date(a as Date).getTime() === new Date(b as Date).getTime();
  }
  if (Array.isArray(a) || Array.isArray(b)) {
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((x, i) => sameValue(x, b[i]));
  }
  return a === b || (a == null && b == null);
}

/** A repeated create (a retry after a lost answer) carries the same values as the stored row. */
function samePayload(values: Record<string, unknown>, row: RecordRow): boolean {
  return Object.entries(values).every(([key, value]) => value === undefined || sameValue(value, row[key]));
}

function staleConflict(def: RecordDef, row: RecordRow) {
  return conflict(
    `This ${def.label.toLowerCase()} was changed by someone else since you opened it (it is now version ${row.version}). Reload it and make your change again.`,
    { reason: "stale", currentVersion: row.version },
  );
}

async function audit(
  tx: Executor,
  ctx: RecordContext,
  def: RecordDef,
  action: string,
  before: RecordRow | null,
  after: RecordRow,
  note?: string,
) {
  await writeAudit(tx, {
    projectId: after.projectId,
    userId: ctx.user.id,
    deviceId: ctx.deviceId ?? null,
    recordType: def.type,
    recordId: after.id,
    action,
    before,
    after,
    note,
  });
}

/**
 * Creates a record with the id the client chose. The same id again with the same values returns
 * the stored row (`created: false`): a retried request changes nothing. Different values: 409.
 */
export async function createRecord(
  ctx: RecordContext,
  type: string,
  projectId: string,
  input: unknown,
): Promise<{ record: RecordRow; created: boolean }> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  const values = parseOrThrow(def.create, input);
  const id = values.id as string;
  return inTransaction(ctx, def, async (tx) => {
    await authorizeIn(ctx, writeActions(def.action), projectId, tx);
    const [existing] = (await tx.select().from(def.table).where(eq(def.table.id, id)).for("update")) as RecordRow[];
    if (existing) {
      if (existing.projectId === projectId && samePayload(values, existing)) return { record: existing, created: false };
      throw conflict(`A ${def.label.toLowerCase()} with this id already exists with other values.`, {
        reason: "exists",
        ...(existing.projectId === projectId ? { currentVersion: existing.version } : {}),
      });
    }
    await checkLinks(tx, def, projectId, values);
    await assertNotSigned(tx, def, values);
    const derived = await computed(tx, def, projectId, values);
    const changeSeq = await nextChangeSeq(tx, projectId);
    const [row] = (await tx
      .insert(def.table)
      .values(newRowValues(ctx, projectId, values, derived, changeSeq) as never)
      .returning()) as RecordRow[];
    await audit(tx, ctx, def, "create", null, row);
    await refreshAfterWrite(tx, projectId, def.type, [row]);
    return { record: row, created: true };
  });
}

/** Applies `patch` to the version the client edited (`baseVersion`); a stale version is a 409. */
export async function updateRecord(
  ctx: RecordContext,
  type: string,
  projectId: string,
  id: string,
  body: unknown,
  options: UpdateOptions = {},
): Promise<RecordRow> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  const { baseVersion: base, patch: rawPatch } = parseOrThrow(updateBodySchema, body);
  const patch = parseOrThrow(def.update, rawPatch);
  const keys = Object.keys(patch).filter((key) => patch[key] !== undefined);
  if (keys.length === 0) {
    throw invalidInput("Nothing to change: send the fields to change.", { patch: "Send at least one field to change" });
  }
  return inTransaction(ctx, def, async (tx) => {
    await authorizeIn(ctx, writeActions(def.action), projectId, tx);
    const existing = await lockRecord(tx, def, projectId, id);
    if (existing.deletedAt) {
      throw conflict(`This ${def.label.toLowerCase()} was deleted.`, { reason: "deleted", currentVersion: existing.version });
    }
    await assertNotSigned(tx, def, existing);
    const mergeable = options.mergeStale && keys.every((key) => def.mergeable.includes(key));
    if (existing.version !== base && !mergeable) throw staleConflict(def, existing);
    // The whole record must still make sense (e.g. discharge end after a start changed elsewhere).
    const merged = parseOrThrow(def.create, { ...existing, ...patch });
    await checkLinks(tx, def, projectId, patch, merged);
    const derived = await computed(tx, def, projectId, merged);
    const changeSeq = await nextChangeSeq(tx, projectId);
    const [row] = (await tx
      .update(def.table)
      .set({ ...patch, ...derived, version: existing.version + 1, changeSeq, updatedAt: new Date(), updatedBy: ctx.user.id } as never)
      .where(and(eq(def.table.id, id), eq(def.table.projectId, projectId)))
      .returning()) as RecordRow[];
    await audit(tx, ctx, def, "update", existing, row);
    await refreshAfterWrite(tx, projectId, def.type, [existing, row]);
    return row;
  });
}

/** Tombstones the children of a deleted record (and theirs), each with its own change number. */
async function tombstoneChildren(tx: Executor, ctx: RecordContext, parent: RecordDef, parentRow: RecordRow) {
  const links = [
    ...childTypes(parent.type).map((def) => ({ def, where: eq(column(def, def.parent!.field), parentRow.id) })),
    // Photos of the record (a typed link: record type and id).
    ...targetingTypes().map((def) => ({
      def,
      where: and(eq(column(def, def.target!.typeField), parent.type), eq(column(def, def.target!.idField), parentRow.id))!,
    })),
  ];
  for (const { def, where } of links) {
    const children = (await tx
      .select()
      .from(def.table)
      .where(and(where, eq(def.table.projectId, parentRow.projectId), isNull(def.table.deletedAt)))
      .for("update")) as RecordRow[];
    for (const child of children) {
      const changeSeq = await nextChangeSeq(tx, parentRow.projectId);
      const [row] = (await tx
        .update(def.table)
        .set({ deletedAt: new Date(), version: child.version + 1, changeSeq, updatedAt: new Date(), updatedBy: ctx.user.id } as never)
        .where(eq(def.table.id, child.id))
        .returning()) as RecordRow[];
      await audit(tx, ctx, def, "delete", child, row, `deleted with its ${parent.label.toLowerCase()}`);
      await tombstoneChildren(tx, ctx, def, row);
    }
  }
}

/**
 * Sets the tombstone (rows are never hard-deleted, so devices learn of the deletion on pull).
 * Deleting a deleted record returns it unchanged; children are tombstoned with their parent.
 */
export async function deleteRecord(
  ctx: RecordContext,
  type: string,
  projectId: string,
  id: string,
  body: unknown,
): Promise<RecordRow> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  const { baseVersion: base } = parseOrThrow(deleteBodySchema, body);
  return inTransaction(ctx, def, async (tx) => {
    await authorizeIn(ctx, writeActions(def.action), projectId, tx);
    const existing = await lockRecord(tx, def, projectId, id);
    if (existing.deletedAt) return existing;
    await assertNotSigned(tx, def, existing);
    const blocked = def.deleteBlocked?.(existing);
    if (blocked) throw conflict(blocked, { reason: "state" });
    if (existing.version !== base) throw staleConflict(def, existing);
    // Read before the tombstones: a placement's days are those of its (still live) children.
    const dates = await datesAffected(tx, projectId, def.type, [existing]);
    const changeSeq = await nextChangeSeq(tx, projectId);
    const [row] = (await tx
      .update(def.table)
      .set({ deletedAt: new Date(), version: existing.version + 1, changeSeq, updatedAt: new Date(), updatedBy: ctx.user.id } as never)
      .where(and(eq(def.table.id, id), eq(def.table.projectId, projectId)))
      .returning()) as RecordRow[];
    await audit(tx, ctx, def, "delete", existing, row);
    await tombstoneChildren(tx, ctx, def, row);
    await refreshFindings(tx, projectId, dates);
    return row;
  });
}
