"use client";

// Thumbnails of a set of photos, each with its caption and state; a tap opens the full-size view.
import { useLiveQuery } from "dexie-react-hooks";
import { Hourglass, ImageOff } from "lucide-react";
import { useState } from "react";
import { photoBadge } from "@/lib/photos/client/upload-state";
import type { BlobRow, LocalRecord } from "@/lib/sync/client";
import { usePhotoProgress, useSyncDb } from "@/lib/sync/client/react";
import { PhotoStateBadge } from "./photo-badge";
import { PhotoViewer } from "./photo-viewer";
import { usePhotoSource } from "./use-photo-source";

function Thumb({ photo, blob, progress, onOpen }: { photo: LocalRecord<"photos">; blob: BlobRow | undefined; progress?: number; onOpen: () => void }) {
  const source = usePhotoSource(photo, blob, "thumb");
  const badge = photoBadge(photo, blob, progress);
  const caption = typeof photo.caption === "string" && photo.caption ? photo.caption : null;
  return (
    <li className="min-w-0" data-testid="photo-thumb" data-photo-id={photo.id} data-source={source.from ?? "none"}>
      <button
        type="button"
        onClick={onOpen}
        className="group relative block aspect-square w-full overflow-hidden rounded-lg border border-ink-200 bg-ink-100 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-lichen-700"
      >
        {source.src ? (
          // eslint-disable-next-line @next/next/no-img-element -- object URLs and presigned links, not optimisable
          <img src={source.src} alt={caption ?? "Photo"} className="h-full w-full object-cover" />
        ) : (
          <span className="flex h-full w-full flex-col items-center justify-center gap-1 p-2 text-center text-xs font-semibold text-ink-700">
            {badge.state === "elsewhere" ? <Hourglass className="h-6 w-6" aria-hidden="true" /> : <ImageOff className="h-6 w-6" aria-hidden="true" />}
            {badge.state === "elsewhere" ? "Not here yet" : "Needs a connection"}
          </span>
        )}
        <span className="sr-only">Open {caption ?? "photo"} full size</span>
        <PhotoStateBadge badge={badge} compact className="absolute bottom-1 left-1 right-1 justify-center" />
      </button>
      {caption ? <p className="mt-1 line-clamp-2 break-words text-sm text-ink-800">{caption}</p> : null}
    </li>
  );
}

/** A grid of photos (already filtered by the caller); `canEdit` allows caption changes in the viewer. */
export function PhotoGrid({ photos, canEdit, timeZone, testId }: { photos: LocalRecord<"photos">[]; canEdit: boolean; timeZone?: string; testId?: string }) {
  const db = useSyncDb();
  const progress = usePhotoProgress();
  const ids = photos.map((p) => p.id);
  const key = ids.join(",");
  const blobs = useLiveQuery(async () => {
    const rows = await db.blobs.bulkGet(key ? key.split(",") : []);
    return new Map(rows.filter((r): r is BlobRow => !!r).map((r) => [r.id, r]));
  }, [db, key]);
  const [open, setOpen] = useState<string | null>(null);
  const current = photos.find((p) => p.id === open);
  if (photos.length === 0) return null;
  return (
    <>
      <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4" data-testid={testId ?? "photo-grid"}>
        {photos.map((photo) => (
          <Thumb key={photo.id} photo={photo} blob={blobs?.get(photo.id)} progress={progress.get(photo.id)} onOpen={() => setOpen(photo.id)} />
        ))}
      </ul>
      {current ? (
        <PhotoViewer
          photo={current}
          blob={blobs?.get(current.id)}
          progress={progress.get(current.id)}
          canEdit={canEdit}
          timeZone={timeZone}
          onClose={() => setOpen(null)}
        />
      ) : null}
    </>
  );
}

/** Newest first would hide the first photo of a pour; the order they were taken reads like the day. */
export const byTaken = (a: LocalRecord<"photos">, b: LocalRecord<"photos">) =>
  String(a.takenAt ?? a.createdAt ?? "").localeCompare(String(b.takenAt ?? b.createdAt ?? ""));
