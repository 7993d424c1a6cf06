// Entry points of the review list routes: validate the query string, then answer a JSON page or
// the CSV of every matching row.
import type { SessionUser } from "@/lib/auth/options";
import { parseOrThrow } from "@/lib/validation";
import { exportDiariesCsv, exportPlacementsCsv } from "./csv";
import { listReviewDiaries } from "./diaries";
import { listReviewPlacements } from "./placements";
import { diaryListQuery, placementListQuery } from "./query-schemas";

export async function reviewPlacements(user: SessionUser, query: Record<string, string>) {
  const q = parseOrThrow(placementListQuery, query);
  return q.format === "csv" ? exportPlacementsCsv(user, q, q.columns) : listReviewPlacements(user, q);
}

export async function reviewDiaries(user: SessionUser, query: Record<string, string>) {
  const q = parseOrThrow(diaryListQuery, query);
  return q.format === "csv" ? exportDiariesCsv(user, q, q.columns) : listReviewDiaries(user, q);
}
