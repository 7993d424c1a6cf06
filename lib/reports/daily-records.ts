// What the daily report adds to the digest's day (lib/digest/load.ts): the day's checklists and
// their items, the stored photos, the temperature records running that day and the signatures of
// the day's placements and diary. Reads only; the PDF is drawn in daily.ts.
import { and, asc, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { db } from "@/db";
import { checklistItems, checklists, diaryEntries, photos, signOffs, users } from "@/db/schema";
import type { loadDigestDay } from "@/lib/digest/load";
import { maturityOfPeriod } from "@/lib/maturity/records";
import { localDayRange } from "@/lib/time/zone";

type DigestDay = Awaited<ReturnType<typeof loadDigestDay>>;

export async function loadReportRecords(projectId: string, date: string, timeZone: string, day: DigestDay) {
  const placementIds = day.placements.map((p) => p.id);
  const { start: dayStart, end: dayEnd } = localDayRange(date, timeZone);
  const [lists, items, dayPhotos, [diaryRow], maturity] = await Promise.all([
    placementIds.length
      ? db.select().from(checklists).where(and(eq(checklists.projectId, projectId), inArray(checklists.placementId, placementIds), isNull(checklists.deletedAt))).orderBy(asc(checklists.createdAt))
      : [],
    placementIds.length
      ? db
          .select({ item: checklistItems, placementId: checklists.placementId })
          .from(checklistItems)
          .innerJoin(checklists, and(eq(checklists.id, checklistItems.checklistId), eq(checklists.projectId, projectId)))
          .where(and(eq(checklistItems.projectId, projectId), inArray(checklists.placementId, placementIds), isNull(checklistItems.deletedAt)))
          .orderBy(asc(checklistItems.createdAt))
      : [],
    day.photos.length
      ? db
          .select()
          .from(photos)
          .where(and(eq(photos.projectId, projectId), inArray(photos.id, day.photos.map((p) => p.id)), isNotNull(photos.storageKey)))
          .orderBy(asc(photos.takenAt))
      : [],
    db.select({ id: diaryEntries.id }).from(diaryEntries).where(and(eq(diaryEntries.projectId, projectId), eq(diaryEntries.date, date), isNull(diaryEntries.deletedAt))),
    maturityOfPeriod(db, projectId, dayStart, dayEnd),
  ]);
  const signedIds = [...placementIds, ...(diaryRow ? [diaryRow.id] : [])];
  const signatures = signedIds.length
    ? await db
        .select({ recordId: signOffs.recordId, recordType: signOffs.recordType, role: signOffs.role, signedAt: signOffs.signedAt, typedName: signOffs.typedName, signerName: users.name, image: signOffs.signatureImage, hash: signOffs.contentHash })
        .from(signOffs)
        .leftJoin(users, eq(users.id, signOffs.signerId))
        .where(and(eq(signOffs.projectId, projectId), inArray(signOffs.recordId, signedIds), isNull(signOffs.deletedAt)))
        .orderBy(asc(signOffs.signedAt))
    : [];
  return { dayEnd, lists, items, dayPhotos, maturity, signatures };
}
