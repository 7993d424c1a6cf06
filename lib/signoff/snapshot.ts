// What a sign-off covers: the placement and every record hanging off it, as stored. Workflow and
// bookkeeping fields (state, versions, change numbers, update stamps) are left out, so the hash
// says whether the *content* still matches what the inspector signed.
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import type { Executor } from "@/db";
import { conflicts, photos } from "@/db/schema";
import { column, getRecordDef, type RecordType } from "@/lib/records/registry";
import { canonicalJson, sha256Hex } from "./canonical";

const CHILD_TYPES: RecordType[] = ["deliveries", "field-tests", "specimen-sets", "weather-observations", "checklists", "curing-readings"];
const BOOKKEEPING = new Set(["version", "changeSeq", "updatedAt", "updatedBy", "createdAt", "state", "holdReason", "signedAt", "signedBy"]);

// Columns added after records were first signed: left out while empty, so a placement signed before
// the column existed still hashes to what was signed (its rows read back with the column null).
const ADDED_LATER = new Set(["mixCode", "testedBy", "notClearedReason", "sensorId"]);

function content(row: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(row).filter(([key, value]) => !BOOKKEEPING.has(key) && !(ADDED_LATER.has(key) && value == null)));
}

async function rowsOf(tx: Executor, type: RecordType, field: string, ids: string[], projectId: string) {
  if (ids.length === 0) return [];
  const def = getRecordDef(type);
  const col = column(def, field);
  return (await tx
    .select()
    .from(def.table)
    .where(and(eq(def.table.projectId, projectId), inArray(col, ids), isNull(def.table.deletedAt)))
    .orderBy(asc(def.table.id))) as Record<string, unknown>[];
}

export type PlacementSnapshot = {
  placement: Record<string, unknown>;
  children: Record<string, Record<string, unknown>[]>;
  photos: Record<string, unknown>[];
  recordIds: string[];
};

export async function placementSnapshot(tx: Executor, projectId: string, placementId: string): Promise<PlacementSnapshot> {
  const def = getRecordDef("placements");
  const [placement] = (await tx
    .select()
    .from(def.table)
    .where(and(eq(def.table.projectId, projectId), eq(def.table.id, placementId)))) as Record<string, unknown>[];
  const children: Record<string, Record<string, unknown>[]> = {};
  for (const type of CHILD_TYPES) children[type] = await rowsOf(tx, type, "placementId", [placementId], projectId);
  children["checklist-items"] = await rowsOf(tx, "checklist-items", "checklistId", children.checklists.map((c) => c.id as string), projectId);
  const recordIds = [placementId, ...Object.values(children).flat().map((r) => r.id as string)];
  const photoRows = (await tx
    .select()
    .from(photos)
    .where(and(eq(photos.projectId, projectId), inArray(photos.recordId, recordIds), isNull(photos.deletedAt)))
    .orderBy(asc(photos.id))) as Record<string, unknown>[];
  return { placement, children, photos: photoRows, recordIds };
}

/** SHA-256 of the canonical JSON of the placement and its records (content only). */
export function snapshotHash(snapshot: PlacementSnapshot): string {
  const body = {
    placement: content(snapshot.placement),
    children: Object.fromEntries(Object.entries(snapshot.children).map(([type, rows]) => [type, rows.map(content)])),
    photos: snapshot.photos.map((p) => ({ id: p.id, recordId: p.recordId, sha256: p.sha256, caption: p.caption })),
  };
  return sha256Hex(canonicalJson(body));
}

/** What still blocks a sign-off: open conflicts on these records and photos not yet stored. */
export async function openItems(tx: Executor, projectId: string, snapshot: PlacementSnapshot) {
  const open = await tx
    .select({ id: conflicts.id, recordType: conflicts.recordType })
    .from(conflicts)
    .where(and(eq(conflicts.projectId, projectId), inArray(conflicts.recordId, snapshot.recordIds), isNull(conflicts.resolvedAt)));
  const pendingPhotos = snapshot.photos.filter((p) => p.storedAt == null);
  return { conflicts: open, pendingPhotos };
}
