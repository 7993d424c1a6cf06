// What the office sees of one project day's diary: the entry and its lists, the day's placements
// (with the review list's figures) and the entry's sign of submission. A day without a diary is
// answered with `diary: null`, so the page can say it is missing.
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { diaryCrew, diaryDelays, diaryEntries, diaryEquipment, diaryVisitors, photos, projects, users } from "@/db/schema";
import { authorize } from "@/lib/auth/authorize";
import type { SessionUser } from "@/lib/auth/options";
import { isLocalDate } from "@/lib/time/zone";
import { invalidInput, notFound } from "@/lib/errors";
import { assertUuid } from "@/lib/records/guards";
import { listReviewPlacements } from "./placements";
import { placementListQuery } from "./query-schemas";

export async function loadDiaryReview(user: SessionUser, projectId: string, date: string) {
  assertUuid(projectId, "Project");
  if (!isLocalDate(date)) throw invalidInput("The date must look like 2026-11-09", { date: "The date must look like 2026-11-09" });
  const role = await authorize(user, "project.read", projectId);
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  const [entry] = await db
    .select({ diary: diaryEntries, submittedByName: users.name })
    .from(diaryEntries)
    .leftJoin(users, eq(users.id, diaryEntries.submittedBy))
    .where(and(eq(diaryEntries.projectId, projectId), eq(diaryEntries.date, date), isNull(diaryEntries.deletedAt)));
  const id = entry?.diary.id;
  const live = <T extends typeof diaryCrew | typeof diaryEquipment | typeof diaryDelays | typeof diaryVisitors>(t: T) =>
    and(eq(t.projectId, projectId), eq(t.diaryEntryId, id!), isNull(t.deletedAt));
  const [crew, equipment, delays, visitors, diaryPhotos] = id
    ? await Promise.all([
        db.select().from(diaryCrew).where(live(diaryCrew)).orderBy(asc(diaryCrew.createdAt)),
        db.select().from(diaryEquipment).where(live(diaryEquipment)).orderBy(asc(diaryEquipment.createdAt)),
        db.select().from(diaryDelays).where(live(diaryDelays)).orderBy(asc(diaryDelays.createdAt)),
        db.select().from(diaryVisitors).where(live(diaryVisitors)).orderBy(asc(diaryVisitors.createdAt)),
        db
          .select({ id: photos.id, caption: photos.caption, takenAt: photos.takenAt, storedAt: photos.storedAt })
          .from(photos)
          .where(and(eq(photos.projectId, projectId), eq(photos.recordType, "diary-entries"), eq(photos.recordId, id!), isNull(photos.deletedAt)))
          .orderBy(asc(photos.takenAt), asc(photos.id)),
      ])
    : [[], [], [], [], []];
  const placements = await listReviewPlacements(user, placementListQuery.parse({ projects: projectId, from: date, to: date, sort: "date", dir: "asc", pageSize: "200" }));
  return {
    role,
    project,
    date,
    diary: entry ? { ...entry.diary, submittedByName: entry.submittedByName } : null,
    crew,
    equipment,
    delays,
    visitors,
    photos: diaryPhotos,
    placements: placements.rows,
  };
}
export type DiaryReview = Awaited<ReturnType<typeof loadDiaryReview>>;
