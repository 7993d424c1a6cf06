// The saved default view of a review table (one zod schema, used by the API and the screen).
// Client-safe: no database imports.
import { z } from "zod";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { fromDay, orderedRange, orderedRangeMessage, sortDir, toDay } from "@/lib/list-query";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS } from "./columns";
import { DIARY_SORTS, DIARY_STATES, PLACEMENT_SORTS, REVIEW_PAGE_SIZES } from "./query-schemas";

const keysOf = <T extends readonly { key: string }[]>(cols: T) => cols.map((c) => c.key) as [T[number]["key"], ...T[number]["key"][]];

const projects = z.array(z.guid({ error: "Projects must be project ids" }), { error: "Projects must be a list" }).max(100, "Choose at most 100 projects");
const pageSize = z
  .number({ error: "Page size must be a number" })
  .refine((n) => (REVIEW_PAGE_SIZES as readonly number[]).includes(n), { message: `Page size must be one of ${REVIEW_PAGE_SIZES.join(", ")}` });

const columns = <T extends [string, ...string[]]>(keys: T) =>
  z
    .array(z.enum(keys, { error: `Columns must be among: ${keys.join(", ")}` }), { error: "Columns must be a list" })
    .min(1, "Show at least one column")
    .refine((cols) => new Set(cols).size === cols.length, { message: "A column is listed twice" });

const oneOf = <T extends readonly [string, ...string[]]>(name: string, values: T) => z.enum(values, { error: `${name} must be one of: ${values.join(", ")}` });

/** What every saved view holds besides its filters, and the filters every list has. */
const viewOf = <L extends string, C extends [string, ...string[]], S extends readonly [string, ...string[]]>(list: L, columnKeys: C, sorts: S) => ({
  list: z.literal(list),
  columns: columns(columnKeys),
  sort: oneOf("Sort", sorts),
  dir: sortDir,
  pageSize,
});
const dayRange = { projects: projects.optional(), from: fromDay.optional(), to: toDay.optional() };

export const placementViewSchema = z
  .object({
    ...viewOf("placements", keysOf(PLACEMENT_COLUMNS), PLACEMENT_SORTS),
    filters: z
      .object({
        ...dayRange,
        state: z.array(oneOf("State", PLACEMENT_STATES)).optional(),
        hasWarnings: z.boolean({ error: "Has warnings must be true or false" }).optional(),
      })
      .strict()
      .refine(orderedRange, orderedRangeMessage),
  })
  .strict();

export const diaryViewSchema = z
  .object({
    ...viewOf("diaries", keysOf(DIARY_COLUMNS), DIARY_SORTS),
    filters: z
      .object({ ...dayRange, state: z.array(oneOf("State", DIARY_STATES)).optional() })
      .strict()
      .refine(orderedRange, orderedRangeMessage),
  })
  .strict();

export const reviewViewSchema = z.discriminatedUnion("list", [placementViewSchema, diaryViewSchema], {
  error: "List must be placements or diaries",
});
export type PlacementView = z.output<typeof placementViewSchema>;
export type DiaryView = z.output<typeof diaryViewSchema>;
export type ReviewView = z.output<typeof reviewViewSchema>;
export type SavedViews = { placements: PlacementView | null; diaries: DiaryView | null };
