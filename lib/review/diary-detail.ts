// What the office sees of one project day's diary: the entry and its lists, the day's placements
// (with the review list's figures) and the entry's sign of submission. A day without a diary is
// answered with `diary: null`, so the page can say it is missing.
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { diaryCrew, diaryDelays, diaryEntries, diaryEquipment, diaryVisitors, photos, users } from "@/db/schema";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { isLocalDate } from "@/lib/time/zone";
import { invalidInput } from "@/lib/errors";
import { listReviewPlacements } from "./placements";
import { placementListQuery } from "./query-schemas";

export async function loadDiaryReview(access: ProjectAccess, date: string) {
  if (!isLocalDate(date)) throw invalidInput("The date must look like 2026-11-09", { date: "The date must look like 2026-11-09" });
  const role = permit(access, "project.read");
  const { project } = access;
  const projectId = project.id;
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
  const placements = await listReviewPlacements(access.user, placementListQuery.parse({ projects: projectId, from: date, to: date, sort: "date", dir: "asc", pageSize: "200" }));
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
