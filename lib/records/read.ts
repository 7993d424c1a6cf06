// Reading records: one by id, or a page of a project's records filtered by date, state and parent.
import { and, asc, eq, getTableColumns, gte, inArray, isNull, lte, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { parseOrThrow } from "@/lib/validation";
import { invalidInput, notFound } from "@/lib/errors";
import { flag, oneOrMoreOf } from "@/lib/list-query";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { accessIn, authorizeIn, permit } from "@/lib/auth/access";
import { assertUuid } from "./guards";
import { column, getRecordDef, type RecordDef } from "./registry";
import type { RecordContext, RecordRow } from "./types";

export const MAX_PAGE = 200;

const dateOrInstant = (label: string) =>
  z.union([z.iso.date(), z.iso.datetime({ offset: true })], {
    error: `${label} must be a date (2026-11-09) or a date and time with its offset`,
  });

/** Query-string filters of a list. Query values are strings, so numbers are coerced here. */
export const listQuerySchema = z.object({
  from: dateOrInstant("From").optional(),
  to: dateOrInstant("To").optional(),
  state: oneOrMoreOf("State", PLACEMENT_STATES).optional(),
  limit: z.coerce
    .number({ error: "Limit must be a number" })
    .int("Limit must be a whole number")
    .min(1, `Limit must be between 1 and ${MAX_PAGE}`)
    .max(MAX_PAGE, `Limit must be between 1 and ${MAX_PAGE}`)
    .optional(),
  cursor: z.string().max(200, "The cursor is not valid").optional(),
  includeDeleted: flag("Include deleted").optional(),
  placementId: z.guid({ error: "Placement must be an id" }).optional(),
  checklistId: z.guid({ error: "Checklist must be an id" }).optional(),
  specimenSetId: z.guid({ error: "Specimen set must be an id" }).optional(),
  diaryEntryId: z.guid({ error: "Diary entry must be an id" }).optional(),
});
export type ListQuery = z.input<typeof listQuerySchema>;

const PARENT_FILTERS = ["placementId", "checklistId", "specimenSetId", "diaryEntryId"] as const;

export type RecordPage = { items: RecordRow[]; nextCursor: string | null };

/** One record of the project; a record of another project, or a tombstone, is a 404. */
export async function getRecord(
  ctx: RecordContext,
  type: string,
  projectId: string,
  id: string,
  options: { includeDeleted?: boolean } = {},
): Promise<RecordRow> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  const tx = ctx.tx ?? db;
  await authorizeIn(ctx, "project.read", projectId, tx);
  const [row] = (await tx
    .select()
    .from(def.table)
    .where(and(eq(def.table.id, id), eq(def.table.projectId, projectId)))) as RecordRow[];
  if (!row || (row.deletedAt && !options.includeDeleted)) throw notFound(def.label);
  return row;
}

// The cursor keeps the main date as Postgres prints it: a JS Date would drop the microseconds of
// a default now() and the next page would repeat the row.
const encodeCursor = (key: string, id: string) => Buffer.from(JSON.stringify([key, id])).toString("base64url");
const CURSOR_KEY = /^\d{4}-\d{2}-\d{2}( \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?)?$/;

function decodeCursor(cursor: string): [string, string] {
  try {
    const parsed = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
    if (Array.isArray(parsed) && parsed.length === 2 && parsed.every((v) => typeof v === "string")) {
      const [key, id] = parsed as [string, string];
      if (CURSOR_KEY.test(key) && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) return [key, id];
    }
  } catch {
    // fall through to the error below
  }
  throw invalidInput("The cursor is not valid; start the list again.", { cursor: "The cursor is not valid" });
}

const isDateOnly = (value: string) => /^\d{4}-\d{2}-\d{2}$/.test(value);

/** Date filters on the record's main date; a bare date means that day in the project's time zone. */
function dateConditions(def: RecordDef, from: string | undefined, to: string | undefined, timeZone: string): SQL[] {
  const col = column(def, def.dateField);
  const conditions: SQL[] = [];
  if (def.dateKind === "date") {
    if (from) conditions.push(gte(col, from.slice(0, 10)));
    if (to) conditions.push(lte(col, to.slice(0, 10)));
    return conditions;
  }
  if (from) {
    conditions.push(
      isDateOnly(from)
        ? sql`${col} >= (${from}::date)::timestamp at time zone ${timeZone}`
        : gte(col, new Date(from)),
    );
  }
  if (to) {
    conditions.push(
      isDateOnly(to)
        ? sql`${col} < ((${to}::date + 1)::timestamp at time zone ${timeZone})`
        : lte(col, new Date(to)),
    );
  }
  return conditions;
}

/**
 * A page of the project's records of one type, ordered by the main date, then id. Tombstones are
 * left out unless `includeDeleted`. `nextCursor` is null on the last page.
 */
export async function listRecords(ctx: RecordContext, type: string, projectId: string, query: unknown): Promise<RecordPage> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  const q = parseOrThrow(listQuerySchema, query ?? {});
  if (q.state && def.type !== "placements") {
    throw invalidInput("Only placements can be filtered by state.", { state: "Only placements have a state" });
  }
  const tx = ctx.tx ?? db;
  const access = await accessIn(ctx, projectId, tx);
  permit(access, "project.read");
  const { project } = access;
  const conditions: SQL[] = [eq(def.table.projectId, projectId)];
  if (!q.includeDeleted) conditions.push(isNull(def.table.deletedAt));
  conditions.push(...dateConditions(def, q.from, q.to, project?.timeZone ?? "UTC"));
  if (q.state) conditions.push(inArray(column(def, "state"), q.state));
  for (const field of PARENT_FILTERS) {
    const value = q[field];
    if (!value) continue;
    const links = [def.parent, ...(def.refs ?? [])].map((link) => link?.field);
    if (!links.includes(field)) {
      throw invalidInput(`${def.label} records cannot be filtered by ${field}.`, { [field]: "Not a filter of this record" });
    }
    conditions.push(eq(column(def, field), value));
  }
  const dateCol = column(def, def.dateField);
  if (q.cursor) {
    const [key, id] = decodeCursor(q.cursor);
    const cast = def.dateKind === "date" ? sql`${key}::date` : sql`${key}::timestamptz`;
    conditions.push(sql`(${dateCol}, ${def.table.id}) > (${cast}, ${id}::uuid)`);
  }
  const limit = q.limit ?? 50;
  const rows = await tx
    .select({ row: getTableColumns(def.table), cursorKey: sql<string>`${dateCol}::text` })
    .from(def.table)
    .where(and(...conditions))
    .orderBy(asc(dateCol), asc(def.table.id))
    .limit(limit + 1);
  const page = rows.slice(0, limit);
  const last = page[page.length - 1];
  return {
    items: page.map(({ row }) => row as RecordRow),
    nextCursor: rows.length > limit ? encodeCursor(last.cursorKey, (last.row as RecordRow).id) : null,
  };
}
