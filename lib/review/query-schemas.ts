// Query-string schemas of the office review lists (one zod schema per input). Query values are
// strings; lists (projects, states) are comma-separated. Client-safe: no database imports.
import { z } from "zod";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { commaList, flag, fromDay, MAX_LIST_PAGE_SIZE, oneOrMoreOf, orderedRange, orderedRangeMessage, pageParam, pageSizeParam, sortDir, toDay } from "@/lib/list-query";

export const REVIEW_PAGE_SIZES = [25, 50, 100, 200] as const;
export const MAX_REVIEW_PAGE_SIZE = MAX_LIST_PAGE_SIZE;
/** The longest date range a diary list may span (it makes one row per project and day). */
export const MAX_DIARY_RANGE_DAYS = 366;

export const PLACEMENT_SORTS = [
  "date",
  "project",
  "element",
  "mix",
  "orderedM3",
  "placedM3",
  "trucks",
  "lateTrucks",
  "waterAddedL",
  "testsOut",
  "evaporationRisk",
  "state",
  "signedBy",
] as const;
export type PlacementSort = (typeof PLACEMENT_SORTS)[number];

export const DIARY_STATES = ["missing", "draft", "submitted"] as const;
export type DiaryState = (typeof DIARY_STATES)[number];
export const DIARY_SORTS = ["date", "project", "state", "placements", "crew", "delayMinutes", "submittedBy"] as const;
export type DiarySort = (typeof DIARY_SORTS)[number];

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const projectsParam = commaList("Projects")
  .refine((ids) => ids.every((id) => UUID.test(id)), { message: "Projects must be project ids separated by commas" })
  .refine((ids) => ids.length <= 100, { message: "Choose at most 100 projects" });

const format = z.enum(["json", "csv"], { error: "Format must be json or csv" }).default("json");
/** CSV only: the chosen columns, in order (checked against the column list by the export). */
const columns = commaList("Columns").refine((keys) => keys.length <= 30, { message: "Too many columns" });

export const placementListQuery = z
  .object({
    projects: projectsParam.optional(),
    from: fromDay.optional(),
    to: toDay.optional(),
    state: oneOrMoreOf("State", PLACEMENT_STATES).optional(),
    hasWarnings: flag("Has warnings").optional(),
    sort: z.enum(PLACEMENT_SORTS, { error: `Sort must be one of: ${PLACEMENT_SORTS.join(", ")}` }).default("date"),
    dir: sortDir.default("desc"),
    page: pageParam,
    pageSize: pageSizeParam,
    format,
    columns: columns.optional(),
    /** CSV only: "project" (default) the screen's units and rounding; "si" the stored SI values, unrounded. */
    units: z.enum(["project", "si"], { error: "Units must be project or si" }).default("project"),
  })
  .strict()
  .refine(orderedRange, orderedRangeMessage);
export type PlacementListQuery = z.output<typeof placementListQuery>;

export const diaryListQuery = z
  .object({
    projects: projectsParam.optional(),
    from: fromDay.optional(),
    to: toDay.optional(),
    state: oneOrMoreOf("State", DIARY_STATES).optional(),
    sort: z.enum(DIARY_SORTS, { error: `Sort must be one of: ${DIARY_SORTS.join(", ")}` }).default("date"),
    dir: sortDir.default("desc"),
    page: pageParam,
    pageSize: pageSizeParam,
    format,
    columns: columns.optional(),
  })
  .strict()
  .refine(orderedRange, orderedRangeMessage)
  .refine(
    (q) => !q.from || !q.to || (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 < MAX_DIARY_RANGE_DAYS,
    { message: `Choose a range of at most ${MAX_DIARY_RANGE_DAYS} days`, path: ["to"] },
  );
export type DiaryListQuery = z.output<typeof diaryListQuery>;

export type EvaporationRiskLevel = "low" | "caution" | "high";

export type PlacementReviewRow = {
  id: string;
  projectId: string;
  projectName: string;
  projectCode: string;
  unitSystem: "SI" | "IP";
  /** Project-local date of the planned start, YYYY-MM-DD. */
  date: string;
  plannedStart: string;
  element: string;
  level: string;
  grid: string;
  mixCode: string | null;
  orderedM3: number | null;
  placedM3: number;
  trucks: number;
  rejectedTrucks: number;
  lateTrucks: number;
  revolutionsOver: number;
  waterAddedL: number;
  waterLoads: number;
  testsOut: number;
  evaporationRisk: EvaporationRiskLevel | null;
  maxEvaporationKgM2H: number | null;
  hasWarnings: boolean;
  state: (typeof PLACEMENT_STATES)[number];
  signedAt: string | null;
  signedBy: string | null;
};

export type DiaryReviewRow = {
  projectId: string;
  projectName: string;
  projectCode: string;
  date: string;
  weekday: boolean;
  diaryId: string | null;
  state: DiaryState;
  placements: number;
  crew: number;
  delayMinutes: number;
  submittedAt: string | null;
  submittedBy: string | null;
};

export type ReviewPage<T> = { rows: T[]; total: number; page: number; pageSize: number };
