// CSV exports of the review lists: the same filters and order as the table, every matching row up
// to EXPORT_LIMIT, the chosen columns in the table's order. Measured values in the project's units
// with the screen's rounding (lib/concrete/units.ts, digits from lib/review/columns.ts) and the unit in
// each header; `units=si` gives the stored SI values unrounded. Rows of projects in both unit systems
// cannot share one header, so such an export is in SI (its headers say so).
import Papa from "papaparse";
import type { SessionUser } from "@/lib/auth/options";
import { invalidInput } from "@/lib/errors";
import { displayText, unitLabel, type UnitSystem } from "@/lib/concrete/units";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS, PLACEMENT_MEASURES, type MeasuredColumn } from "./columns";
import { allReviewDiaries } from "./diaries";
import { allReviewPlacements } from "./placements";
import type { DiaryListQuery, DiaryReviewRow, PlacementListQuery, PlacementReviewRow } from "./query-schemas";

export const EXPORT_LIMIT = 20_000;

/**
 * Text typed on site (element, level, grid, names) can start with = + - @ tab or CR, which a
 * spreadsheet runs as a formula; such cells are prefixed with ' (numbers are left alone).
 * [OWASP, "CSV Injection"]
 */
const UNPARSE = { escapeFormulae: true } as const;

type Units = "project" | "si";
type Measured = keyof typeof PLACEMENT_MEASURES;
const isMeasured = (key: string): key is Measured => key in PLACEMENT_MEASURES;

const PLACEMENT_VALUE: Record<Exclude<(typeof PLACEMENT_COLUMNS)[number]["key"], Measured>, (r: PlacementReviewRow) => string | number | null> = {
  date: (r) => r.date,
  project: (r) => r.projectName,
  element: (r) => [r.element, r.level, r.grid].filter(Boolean).join(" · "),
  mix: (r) => r.mixCode,
  trucks: (r) => r.trucks,
  lateTrucks: (r) => r.lateTrucks,
  testsOut: (r) => r.testsOut,
  evaporationRisk: (r) => r.evaporationRisk,
  state: (r) => r.state,
  signedBy: (r) => r.signedBy,
};

const MEASURED_SI: Record<Measured, (r: PlacementReviewRow) => number | null> = {
  orderedM3: (r) => r.orderedM3,
  placedM3: (r) => r.placedM3,
  waterAddedL: (r) => r.waterAddedL,
};

/** The one unit system of the export: the rows' own when they share it, else SI. */
function exportSystem(rows: PlacementReviewRow[], units: Units): UnitSystem | "raw" {
  if (units === "si") return "raw";
  const systems = new Set(rows.map((r): UnitSystem => (r.unitSystem === "IP" ? "IP" : "SI")));
  return systems.size === 1 ? [...systems][0] : "SI";
}

function measuredCell(key: Measured, r: PlacementReviewRow, system: UnitSystem | "raw"): string | number | null {
  const si = MEASURED_SI[key](r);
  if (si === null) return null;
  if (system === "raw") return si;
  const { quantity, digits } = PLACEMENT_MEASURES[key] as MeasuredColumn;
  // A number, not text: a spreadsheet sums it, and a negative is never taken for a formula.
  return Number(displayText(quantity, si, system, digits));
}

function header(col: { key: string; label: string }, system: UnitSystem | "raw"): string {
  if (!isMeasured(col.key)) return col.label;
  return `${col.label} (${unitLabel(PLACEMENT_MEASURES[col.key].quantity, system === "raw" ? "SI" : system)})`;
}

const DIARY_VALUE: Record<(typeof DIARY_COLUMNS)[number]["key"], (r: DiaryReviewRow) => string | number | null> = {
  date: (r) => r.date,
  project: (r) => r.projectName,
  state: (r) => r.state,
  placements: (r) => r.placements,
  crew: (r) => r.crew,
  delayMinutes: (r) => r.delayMinutes,
  submittedBy: (r) => r.submittedBy,
};

function pick<K extends string>(all: readonly { key: K; label: string }[], columns: string[] | undefined) {
  if (!columns?.length) return [...all];
  const unknown = columns.filter((c) => !all.some((col) => col.key === c));
  if (unknown.length) throw invalidInput(`Unknown column: ${unknown[0]}`, { columns: `Columns must be among: ${all.map((c) => c.key).join(", ")}` });
  return all.filter((col) => columns.includes(col.key));
}

export function csvResponse(text: string, name: string): Response {
  return new Response(text, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "no-store",
    },
  });
}

export function placementsCsv(rows: PlacementReviewRow[], columns?: string[], units: Units = "project"): string {
  const cols = pick(PLACEMENT_COLUMNS, columns);
  const system = exportSystem(rows, units);
  const cell = (key: (typeof cols)[number]["key"], r: PlacementReviewRow) => (isMeasured(key) ? measuredCell(key, r, system) : PLACEMENT_VALUE[key](r));
  return Papa.unparse({ fields: cols.map((c) => header(c, system)), data: rows.map((r) => cols.map((c) => cell(c.key, r) ?? "")) }, UNPARSE);
}

export function diariesCsv(rows: DiaryReviewRow[], columns?: string[]): string {
  const cols = pick(DIARY_COLUMNS, columns);
  return Papa.unparse({ fields: cols.map((c) => c.label), data: rows.map((r) => cols.map((c) => DIARY_VALUE[c.key](r) ?? "")) }, UNPARSE);
}

export async function exportPlacementsCsv(user: SessionUser, q: PlacementListQuery, columns?: string[]): Promise<Response> {
  pick(PLACEMENT_COLUMNS, columns);
  return csvResponse(placementsCsv(await allReviewPlacements(user, q, EXPORT_LIMIT), columns, q.units), "placements.csv");
}

export async function exportDiariesCsv(user: SessionUser, q: DiaryListQuery, columns?: string[]): Promise<Response> {
  pick(DIARY_COLUMNS, columns);
  return csvResponse(diariesCsv(await allReviewDiaries(user, q, EXPORT_LIMIT), columns), "diaries.csv");
}
