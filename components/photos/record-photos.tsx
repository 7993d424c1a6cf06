"use client";

// The gallery and add-photo control of any record (shared contract: RecordPhotos).
import { useLiveQuery } from "dexie-react-hooks";
import { Images } from "lucide-react";
import type { PhotoTarget } from "@/lib/photos/rules";
import type { LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { AddPhoto } from "./add-photo";
import { byTaken, PhotoGrid } from "./photo-grid";

/** The photos of one record, on this device (synced or taken here), in the order they were taken. */
export function useRecordPhotos(recordType: string, recordId: string): LocalRecord[] | undefined {
  const db = useSyncDb();
  return useLiveQuery(
    async () =>
      (await db.records("photos").where("[recordType+recordId]").equals([recordType, recordId]).toArray()).filter((p) => !p.deletedAt).sort(byTaken),
    [db, recordType, recordId],
  );
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
  return (
    <div className="mt-3 border-t border-ink-100 pt-3" data-testid="record-photos" data-record-type={recordType} data-record-id={recordId}>
      <h3 className="mb-2 flex items-center gap-2 text-base font-bold text-ink-900">
        <Images className="h-5 w-5" aria-hidden="true" />
        {title}
        <span className="text-sm font-normal text-muted">({photos.length === 0 ? "none yet" : photos.length})</span>
      </h3>
      <PhotoGrid photos={photos} canEdit={canAdd} timeZone={timeZone} />
      {canAdd ? <AddPhoto projectId={projectId} recordType={recordType as PhotoTarget} recordId={recordId} /> : null}
    </div>
  );
}
