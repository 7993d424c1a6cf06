"use client";

// The gallery and add-photo control of any record (shared contract: RecordPhotos).
import { useLiveQuery } from "dexie-react-hooks";
import { ImagePlus, Images } from "lucide-react";
import { useState } from "react";
import { can } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import type { PhotoTarget } from "@/lib/photos/rules";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { AddPhoto } from "./add-photo";
import { byTaken, PhotoGrid } from "./photo-grid";

/** The photos of one record, on this device (synced or taken here), in the order they were taken. */
export function useRecordPhotos(recordType: string, recordId: string): LocalRecord<"photos">[] | undefined {
  const db = useSyncDb();
  return useLiveQuery(
    async () =>
      (await db.typedRecords("photos").where("[recordType+recordId]").equals([recordType, recordId]).toArray()).filter((p) => !p.deletedAt).sort(byTaken),
    [db, recordType, recordId],
  );
}

/**
 * Whether this person may add photos here: "photo.add" on the project (owners only view), and not
 * on a signed placement (a later photo goes with an amendment).
 */
export function canAddPhotos(project: ProjectRow | undefined, placement?: LocalRecord<"placements"> | null): boolean {
  const role = (project?.role ?? null) as ProjectRole | null;
  return !!role && can({ isAdmin: false }, "photo.add", role) && placement?.state !== "signed";
}

export function RecordPhotos({
  projectId,
  recordType,
  recordId,
  canAdd,
  title = "Photos",
}: {
  projectId: string;
  recordType: string;
  recordId: string;
  canAdd: boolean;
  title?: string;
}) {
  const photos = useRecordPhotos(recordType, recordId) ?? [];
  const db = useSyncDb();
  const timeZone = useLiveQuery(async () => (await db.projects.get(projectId))?.timeZone, [db, projectId]);
  const [adding, setAdding] = useState(false);
  return (
    <div className="mt-3 border-t border-ink-100 pt-2" data-testid="record-photos" data-record-type={recordType} data-record-id={recordId}>
      <div className="mb-2 flex min-h-11 items-center gap-2">
        <h3 className="flex items-center gap-2 text-base font-bold text-ink-900">
          <Images className="h-5 w-5" aria-hidden="true" />
          {title}
          <span className="text-sm font-normal text-muted">({photos.length === 0 ? "none yet" : photos.length})</span>
        </h3>
        {canAdd ? (
          <button
            type="button"
            aria-expanded={adding}
            onClick={() => setAdding((a) => !a)}
            data-testid="add-photo-toggle"
            className="ml-auto inline-flex min-h-11 items-center gap-1 rounded-lg px-3 text-sm font-semibold text-lichen-800 hover:bg-lichen-50"
          >
            <ImagePlus className="h-4 w-4" aria-hidden="true" />
            {adding ? "Done" : "Add photo"}
          </button>
        ) : null}
      </div>
      <PhotoGrid photos={photos} canEdit={canAdd} timeZone={timeZone} />
      {canAdd && adding ? <AddPhoto projectId={projectId} recordType={recordType as PhotoTarget} recordId={recordId} /> : null}
    </div>
  );
}
