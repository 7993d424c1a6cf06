"use client";

// Every photo of a project's day (diary screen): photos taken that calendar day in the project's
// time zone, whatever record they belong to.
import { useLiveQuery } from "dexie-react-hooks";
import { Images } from "lucide-react";
import { dateInZone } from "@/components/field/project-time";
import { useSyncDb } from "@/lib/sync/client/react";
import { byTaken, PhotoGrid } from "./photo-grid";

export function DayPhotos({ projectId, date, timeZone, canEdit }: { projectId: string; date: string; timeZone: string; canEdit: boolean }) {
  const db = useSyncDb();
  const photos = useLiveQuery(
    async () =>
      (await db.typedRecords("photos").where("projectId").equals(projectId).toArray())
        .filter((p) => !p.deletedAt)
        .filter((p) => {
          const when = new Date(String(p.takenAt ?? p.createdAt ?? ""));
          return !Number.isNaN(when.getTime()) && dateInZone(when, timeZone) === date;
        })
        .sort(byTaken),
    [db, projectId, date, timeZone],
  );
  return (
    <section className="card p-4" data-testid="day-photos" aria-label="Photos of the day">
      <h2 className="mb-3 flex items-center gap-2 text-xl font-bold text-ink-950">
        <Images className="h-5 w-5" aria-hidden="true" />
        Photos of the day
        <span className="text-sm font-normal text-muted">({photos?.length ?? 0})</span>
      </h2>
      {photos && photos.length > 0 ? (
        <PhotoGrid photos={photos} canEdit={canEdit} timeZone={timeZone} testId="day-photo-grid" />
      ) : (
        <p className="text-sm text-muted">No photos taken on this day yet. Photos added to any record of the day appear here.</p>
      )}
    </section>
  );
}
