// Checks shared by the write functions: ids in the URL, links to other records, the signed freeze.
import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db";
import { amendments } from "@/db/schema";
import { PHOTO_SIGNED_MESSAGE } from "@/lib/photos/rules";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import { assertVisitNotSigned } from "@/lib/site-visits/freeze";
import { signedConflict } from "./db-errors";
import type { Link } from "./record-def";
import { getRecordDef, type RecordDef } from "./registry";
import type { RecordRow } from "./types";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An id from a URL that is not a UUID cannot name anything: 404, not a database error. */
export function assertUuid(value: string, what: string): void {
  if (!UUID.test(value)) throw notFound(what);
}

/**
 * Where the checks below read the rows a record points at. The default reads the database (links
 * FOR SHARE, as each check says); the sync push's set-based creates pass rows it has already read
 * and locked FOR SHARE in one statement per table, so the same checks run over them in memory.
 */
export type RowSource = (type: string, id: string, opts: { projectId?: string; lock?: "share" }) => Promise<RecordRow | undefined>;

export const dbRows =
  (tx: Executor): RowSource =>
  async (type, id, { projectId, lock }) => {
    const target = getRecordDef(type);
    const where = projectId ? and(eq(target.table.id, id), eq(target.table.projectId, projectId)) : eq(target.table.id, id);
    const query = tx.select().from(target.table).where(where);
    const [row] = lock ? await query.for(lock) : await query;
    return row as RecordRow | undefined;
  };

/** The record with this id in this project, locked for the rest of the transaction; 404 otherwise. */
export async function lockRecord(tx: Executor, def: RecordDef, projectId: string, id: string): Promise<RecordRow> {
  const [row] = await tx
    .select()
    .from(def.table)
    .where(and(eq(def.table.id, id), eq(def.table.projectId, projectId)))
    .for("update");
  if (!row) throw notFound(def.label);
  return row as RecordRow;
}

/**
 * The parent and referenced records must exist in the same project and not be deleted; a test's
 * delivery must belong to the test's placement. Only the links present in `values` are checked.
 */
export async function checkLinks(
  tx: Executor,
  def: RecordDef,
  projectId: string,
  values: Record<string, unknown>,
  record: Record<string, unknown> = values,
  rows: RowSource = dbRows(tx),
): Promise<void> {
  const links: Link[] = [def.parent, ...(def.refs ?? [])].filter((link) => link !== undefined);
  for (const link of links) {
    const value = values[link.field];
    // A list of links (a visit's placements) is checked one id at a time.
    for (const id of Array.isArray(value) ? value : [value]) {
      if (id === undefined || id === null) continue;
      const target = getRecordDef(link.type);
      const row = await rows(link.type, id as string, { projectId, lock: "share" });
      const name = target.label.toLowerCase();
      if (!row) {
        const message = `There is no ${name} with this id on this project`;
        throw invalidInput(message, { [link.field]: message });
      }
      if (row.deletedAt) {
        const message = `That ${name} was deleted`;
        throw invalidInput(message, { [link.field]: message });
      }
      if (link.samePlacement && row.placementId !== record.placementId) {
        const message = `That ${name} belongs to another placement`;
        throw invalidInput(message, { [link.field]: message });
      }
    }
  }
  if (def.target) await checkTarget(tx, def, projectId, values, rows);
}

/** A typed link (a photo's record): the record exists in the project and is not deleted. */
async function checkTarget(tx: Executor, def: RecordDef, projectId: string, values: Record<string, unknown>, rows: RowSource) {
  const { typeField, idField } = def.target!;
  const type = values[typeField];
  const id = values[idField];
  if (typeof type !== "string" || typeof id !== "string") return;
  if (type === "amendments") {
    const [row] = await tx
      .select({ id: amendments.id, deletedAt: amendments.deletedAt })
      .from(amendments)
      .where(and(eq(amendments.id, id), eq(amendments.projectId, projectId)));
    if (!row || row.deletedAt) {
      const message = "There is no amendment with this id on this project";
      throw invalidInput(message, { [idField]: message });
    }
    return;
  }
  const target = getRecordDef(type);
  const row = await rows(type, id, { projectId, lock: "share" });
  const name = target.label.toLowerCase();
  if (!row || row.deletedAt) {
    const message = row ? `That ${name} was deleted` : `There is no ${name} with this id on this project`;
    throw invalidInput(message, { [idField]: message });
  }
}

/** The placement whose sign-off freezes this record, if any. */
async function freezingPlacementId(rows: RowSource, def: RecordDef, row: Record<string, unknown>): Promise<string | null> {
  switch (def.frozenBy) {
    case "self":
      return (row.id as string) ?? null;
    case "placementId":
      return (row.placementId as string | null | undefined) ?? null;
    case "checklist": {
      const checklist = await rows("checklists", row.checklistId as string, {});
      return (checklist?.placementId as string | null | undefined) ?? null;
    }
    case "record": {
      // A photo: frozen with the record it shows (an amendment is never frozen).
      const { typeField, idField } = def.target!;
      const type = row[typeField];
      if (typeof type !== "string" || type === "amendments" || typeof row[idField] !== "string") return null;
      const target = getRecordDef(type);
      const targetRow = await rows(type, row[idField] as string, {});
      return targetRow ? freezingPlacementId(rows, target, targetRow) : null;
    }
    default:
      return null;
  }
}

/**
 * 409 when the record (or the placement it belongs to) is signed. The placement row is read FOR
 * SHARE, so a sign-off running at the same time waits for this write, or this write sees it.
 * The database trigger refuses the same changes; this check gives the friendly answer first.
 */
export async function assertNotSigned(
  tx: Executor,
  def: RecordDef,
  row: Record<string, unknown>,
  rows: RowSource = dbRows(tx),
): Promise<void> {
  if (def.frozenBy === "visit" || def.frozenBy === "siteVisitId") return assertVisitNotSigned(tx, def.frozenBy, row);
  if (def.frozenBy === "self" && row.state === "signed") throw signedConflict();
  if (def.frozenBy === "record") {
    const placementId = await freezingPlacementId(rows, def, row);
    if (!placementId) return;
    const placement = await rows("placements", placementId, { lock: "share" });
    if (placement?.state === "signed") throw conflict(PHOTO_SIGNED_MESSAGE, { reason: "signed" });
    return;
  }
  const placementId = await freezingPlacementId(rows, def, row);
  if (!placementId) return;
  const placement = await rows("placements", placementId, { lock: "share" });
  if (placement?.state === "signed") throw signedConflict();
}

