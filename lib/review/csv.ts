// CSV exports of the review lists: the same filters and order as the table, every matching row up
// to EXPORT_LIMIT, the chosen columns in the table's order. Values are SI as stored (units in the headers).
import Papa from "papaparse";
import type { SessionUser } from "@/lib/auth/options";
import { invalidInput } from "@/lib/errors";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS } from "./columns";
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

const PLACEMENT_VALUE: Record<(typeof PLACEMENT_COLUMNS)[number]["key"], (r: PlacementReviewRow) => string | number | null> = {
  date: (r) => r.date,
  project: (r) => r.projectName,
  element: (r) => [r.element, r.level, r.grid].filter(Boolean).join(" · "),
  mix: (r) => r.mixCode,
  orderedM3: (r) => r.orderedM3,
  placedM3: (r) => Math.round(r.placedM3 * 100) / 100,
  trucks: (r) => r.trucks,
  lateTrucks: (r) => r.lateTrucks,
  waterAddedL: (r) => Math.round(r.waterAddedL * 10) / 10,
  testsOut: (r) => r.testsOut,
  evaporationRisk: (r) => r.evaporationRisk,
  state: (r) => r.state,
  signedBy: (r) => r.signedBy,
};

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

export function placementsCsv(rows: PlacementReviewRow[], columns?: string[]): string {
  const cols = pick(PLACEMENT_COLUMNS, columns);
  return Papa.unparse({ fields: cols.map((c) => c.label), data: rows.map((r) => cols.map((c) => PLACEMENT_VALUE[c.key](r) ?? "")) }, UNPARSE);
}

export function diariesCsv(rows: DiaryReviewRow[], columns?: string[]): string {
  const cols = pick(DIARY_COLUMNS, columns);
  return Papa.unparse({ fields: cols.map((c) => c.label), data: rows.map((r) => cols.map((c) => DIARY_VALUE[c.key](r) ?? "")) }, UNPARSE);
}

export async function exportPlacementsCsv(user: SessionUser, q: PlacementListQuery, columns?: string[]): Promise<Response> {
  pick(PLACEMENT_COLUMNS, columns);
  return csvResponse(placementsCsv(await allReviewPlacements(user, q, EXPORT_LIMIT), columns), "placements.csv");
}

export async function exportDiariesCsv(user: SessionUser, q: DiaryListQuery, columns?: string[]): Promise<Response> {
  pick(DIARY_COLUMNS, columns);
  return csvResponse(diariesCsv(await allReviewDiaries(user, q, EXPORT_LIMIT), columns), "diaries.csv");
}
