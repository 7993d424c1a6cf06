// Saved default views of the review tables, one per user and list. A personal screen preference,
// not a project record: no project, no audit entry. A stored view that no longer validates (a
// column was renamed) reads as "no saved view" rather than breaking the screen.
import { and, eq, sql } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { reviewViews } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { diaryViewSchema, placementViewSchema, type ReviewView, type SavedViews } from "./view-schema";

export async function getReviewViews(user: SessionUser, tx: Executor = db): Promise<SavedViews> {
  const rows = await tx.select().from(reviewViews).where(eq(reviewViews.userId, user.id));
  const find = (list: string) => rows.find((r) => r.list === list)?.settings;
  const p = placementViewSchema.safeParse(find("placements"));
  const d = diaryViewSchema.safeParse(find("diaries"));
  return { placements: p.success ? p.data : null, diaries: d.success ? d.data : null };
}

export async function saveReviewView(user: SessionUser, view: ReviewView, tx: Executor = db): Promise<SavedViews> {
  await tx
    .insert(reviewViews)
    .values({ userId: user.id, list: view.list, settings: view })
    .onConflictDoUpdate({ target: [reviewViews.userId, reviewViews.list], set: { settings: view, updatedAt: sql`now()` } });
  return getReviewViews(user, tx);
}

export async function deleteReviewView(user: SessionUser, list: "placements" | "diaries", tx: Executor = db): Promise<SavedViews> {
  await tx.delete(reviewViews).where(and(eq(reviewViews.userId, user.id), eq(reviewViews.list, list)));
  return getReviewViews(user, tx);
}
