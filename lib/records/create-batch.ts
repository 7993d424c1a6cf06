// Set-based creates for the sync push: a run of a device's creates is checked in memory against
// rows read (and locked FOR SHARE) in one statement, then written with one multi-row
// INSERT per table, one change-number reservation per project and one audit statement.
// Only creates that pass every check of createRecord take this way, and the checks are the same
// functions (guards.ts over a RowSource, can() through allows(), derivedValues). Anything else (an
// id that exists, a refused link, a signed placement, a role that may not write, invalid input)
// is left to createRecord, the one write path, which gives the answer and its message.
import { sql } from "drizzle-orm";
import type { Transaction } from "@/db";
import { decodeRow, insertMany } from "@/db/json-rows";
import { writeAudits } from "@/lib/audit";
import { checkFindings } from "@/db/schema";
import { judgeNewRows, judgedOneByOne, withMixes, type Placements } from "@/lib/findings/created";
import { datesAffected, refreshFindings, type FindingRow } from "@/lib/findings/store";
import { accessIn, allows, type ProjectAccess } from "@/lib/auth/access";
import { writeActions } from "./access";
import { reserveChangeSeqs } from "./change-seq";
import { derivedValues, newRowValues } from "./compute";
import { assertNotSigned, checkLinks, dbRows, type RowSource } from "./guards";
import { getRecordDef, type RecordDef } from "./registry";
import type { RecordContext, RecordRow } from "./types";

export type CreateInput = { type: string; projectId: string; input: unknown };
export type PlannedCreate = {
  def: RecordDef;
  projectId: string;
  values: Record<string, unknown>;
  derived: Record<string, unknown>;
  /** The placement it belongs to, as the checks read it (locked FOR SHARE): the rulebook judges with it. */
  placement?: RecordRow;
};

/** Types whose checks read only rows by id: no typed link (photos) and no visit-report freeze. */
const batchable = (def: RecordDef) =>
  !def.target && (def.frozenBy === null || def.frozenBy === "self" || def.frozenBy === "placementId" || def.frozenBy === "checklist");

/** The ids a create's checks will read, by record type: its own id and every link. */
function idsToRead(def: RecordDef, values: Record<string, unknown>, into: Map<string, Set<string>>) {
  const add = (type: string, id: unknown) => {
    if (typeof id !== "string") return;
    if (!into.has(type)) into.set(type, new Set());
    into.get(type)!.add(id);
  };
  add(def.type, values.id);
  for (const link of [def.parent, ...(def.refs ?? [])]) {
    if (!link) continue;
    const value = values[link.field];
    for (const id of Array.isArray(value) ? value : [value]) add(link.type, id);
  }
  if (def.frozenBy === "placementId") add("placements", values.placementId);
  if (def.frozenBy === "checklist") add("checklists", values.checklistId);
}

/**
 * Rows by type and id, locked FOR SHARE until commit, read in ONE statement whatever the number of
 * types (one locking WITH per table, the rows as JSON, decoded by the ORM's column mappers).
 */
async function readRows(tx: Transaction, wanted: Map<string, Set<string>>) {
  const types = [...wanted.keys()];
  const rows = new Map<string, Map<string, RecordRow | null>>(types.map((type) => [type, new Map([...wanted.get(type)!].map((id) => [id, null]))]));
  if (types.length === 0) return rows;
  const parts = types.map((type, k) => {
    const ids = `{${[...wanted.get(type)!].join(",")}}`;
    return sql`${sql.identifier(`t${k}`)} as (select ${sql.raw(String(k))} as k, row_to_json(r) as row from ${getRecordDef(type).table} r where r.id = any(${ids}::uuid[]) for share)`;
  });
  const union = sql.join(
    types.map((_, k) => sql`select k, row from ${sql.identifier(`t${k}`)}`),
    sql` union all `,
  );
  const found = await tx.execute(sql`with ${sql.join(parts, sql`, `)} ${union}`);
  for (const { k, row } of found.rows as { k: number; row: Record<string, unknown> }[]) {
    const type = types[Number(k)];
    const decoded = decodeRow(getRecordDef(type).table, row) as RecordRow;
    rows.get(type)!.set(decoded.id, decoded);
  }
  return rows;
}

/**
 * The longest prefix of `creates` that can be written set-based, each checked in order as
 * createRecord would check it (a create may link to one earlier in the prefix). Reads a handful
 * of statements whatever the length; returns [] when the first create needs the one-by-one path.
 */
export async function planCreates(tx: Transaction, ctx: RecordContext, creates: CreateInput[]): Promise<PlannedCreate[]> {
  const parsed: PlannedCreate[] = [];
  for (const c of creates) {
    const def = getRecordDef(c.type);
    if (!batchable(def)) break;
    const values = def.create.safeParse(c.input);
    if (!values.success) break;
    parsed.push({ def, projectId: c.projectId, values: values.data, derived: {} });
  }
  if (parsed.length === 0) return [];

  const wanted = new Map<string, Set<string>>();
  for (const p of parsed) idsToRead(p.def, p.values, wanted);
  const projectIds = [...new Set(parsed.map((p) => p.projectId))];
  const rows = await readRows(tx, wanted);
  const access = new Map<string, ProjectAccess>();
  for (const id of projectIds) access.set(id, await accessIn(ctx, id, tx));
  const fallback = dbRows(tx);
  const source: RowSource = async (type, id, opts) => {
    const byId = rows.get(type);
    if (!byId?.has(id)) return fallback(type, id, opts);
    const row = byId.get(id) ?? undefined;
    return opts.projectId && row?.projectId !== opts.projectId ? undefined : row;
  };

  const planned: PlannedCreate[] = [];
  for (const p of parsed) {
    const id = p.values.id as string;
    const on = access.get(p.projectId)!;
    if (!writeActions(p.def.action).some((action) => allows(on, action))) break;
    if (rows.get(p.def.type)?.get(id)) break; // a retry or a clash: createRecord compares the payloads
    try {
      await checkLinks(tx, p.def, p.projectId, p.values, p.values, source);
      await assertNotSigned(tx, p.def, p.values, source);
      p.derived = derivedValues(p.def, p.projectId, p.values, on.project.unitSystem ?? "SI");
    } catch {
      break;
    }
    // Later creates of the run may point at this one.
    rows.get(p.def.type)!.set(id, { ...p.values, ...p.derived, projectId: p.projectId, version: 1, deletedAt: null } as RecordRow);
    const placementId = p.values.placementId;
    planned.push(typeof placementId === "string" ? { ...p, placement: rows.get("placements")?.get(placementId) ?? undefined } : p);
  }
  return planned;
}

/**
 * Writes planned creates: change numbers in plan order, one INSERT per table, one audit statement,
 * then the stored findings (lib/findings). What can be read before the project's change counter is
 * read first, since taking a number holds that counter's lock until commit.
 */
export async function writeCreates(tx: Transaction, ctx: RecordContext, planned: PlannedCreate[]): Promise<RecordRow[]> {
  const around = new Map<string, Placements>();
  for (const projectId of new Set(planned.map((p) => p.projectId))) {
    const judged = planned.filter((p) => p.projectId === projectId && judgedOneByOne(p.def.type));
    // A placement created earlier in this run is judged from its stored row (below), not this one.
    const read = [...new Map(judged.flatMap((p) => (p.placement ? [[p.placement.id, p.placement] as const] : []))).values()];
    if (judged.length) around.set(projectId, await withMixes(tx, projectId, read));
  }
  const nextSeq = new Map<string, number>();
  for (const projectId of new Set(planned.map((p) => p.projectId))) {
    const count = planned.filter((p) => p.projectId === projectId).length;
    nextSeq.set(projectId, await reserveChangeSeqs(tx, projectId, count));
  }
  const values = planned.map((p) => {
    const changeSeq = nextSeq.get(p.projectId)!;
    nextSeq.set(p.projectId, changeSeq + 1);
    return newRowValues(ctx, p.projectId, p.values, p.derived, changeSeq);
  });
  const written = new Map<string, RecordRow>();
  for (const type of new Set(planned.map((p) => p.def.type))) {
    const def = getRecordDef(type);
    const rows = values.filter((_, i) => planned[i].def.type === type);
    for (const row of (await insertMany(tx, def.table, rows)) as RecordRow[]) written.set(row.id, row);
  }
  const result = planned.map((p) => written.get(p.values.id as string)!);
  await writeAudits(
    tx,
    planned.map((p, i) => ({
      projectId: p.projectId,
      userId: ctx.user.id,
      deviceId: ctx.deviceId ?? null,
      recordType: p.def.type,
      recordId: result[i].id,
      action: "create",
      before: null,
      after: result[i],
    })),
  );
  await storeFindings(tx, ctx, planned, result, around);
  return result;
}

/**
 * The rulebook's stored findings after the creates (lib/findings): new trucks and curing readings
 * judged on their own and stored in one statement; the days of any other kind judged again whole,
 * once per project (those days' findings then include the new rows, so none is stored twice).
 */
async function storeFindings(tx: Transaction, ctx: RecordContext, planned: PlannedCreate[], result: RecordRow[], around: Map<string, Placements>) {
  const judged: FindingRow[] = [];
  // A placement created in this run is judged as stored, not as the plan held it.
  const created = new Map(result.filter((_, i) => planned[i].def.type === "placements").map((row) => [row.id, row]));
  for (const projectId of new Set(planned.map((p) => p.projectId))) {
    const { project } = await accessIn(ctx, projectId, tx);
    const dates: string[] = [];
    const own: FindingRow[] = [];
    for (const type of new Set(planned.filter((p) => p.projectId === projectId).map((p) => p.def.type))) {
      const rows = result.filter((_, i) => planned[i].projectId === projectId && planned[i].def.type === type);
      const known = around.get(projectId);
      const placements = known?.placements.map((p) => created.get(String(p.id)) ?? p) ?? [];
      const alone = known ? judgeNewRows(project, type, rows, { placements, mixes: known.mixes }) : null;
      if (alone) own.push(...alone);
      else dates.push(...(await datesAffected(tx, projectId, type, rows)));
    }
    await refreshFindings(tx, projectId, dates);
    judged.push(...own.filter((row) => !dates.includes(row.localDate)));
  }
  if (judged.length) await insertMany(tx, checkFindings, judged, { returning: false });
}
