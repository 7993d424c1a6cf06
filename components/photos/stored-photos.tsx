"use client";

// Photos read from the server (office and owner screens): thumbnails from short-lived presigned
// links, a full-size view on tap, and a placeholder for a photo still on a field device. Unlike
// RecordPhotos it needs no local database, so it works on pages rendered from the server's record.
import { Hourglass, X } from "lucide-react";
import { useEffect, useState } from "react";
import { presignedViewUrl } from "./use-photo-source";

export type StoredPhoto = { id: string; caption: string | null; takenAt: string | Date | null; storedAt: string | Date | null };

function usePresigned(projectId: string, photo: StoredPhoto): string | null {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    let cancelled = false;
    if (photo.storedAt) void presignedViewUrl(projectId, photo.id).then((u) => !cancelled && setUrl(u));
    return () => {
      cancelled = true;
    };
  }, [projectId, photo.id, photo.storedAt]);
  return url;
}

function Thumb({ projectId, photo, onOpen }: { projectId: string; photo: StoredPhoto; onOpen: (url: string) => void }) {
  const url = usePresigned(projectId, photo);
  return (
    <li className="min-w-0" data-testid="stored-photo" data-photo-id={photo.id} data-stored={photo.storedAt ? "yes" : "no"}>
      <button
        type="button"
        disabled={!url}
        onClick={() => url && onOpen(url)}
        className="block aspect-square w-full overflow-hidden rounded-md border border-ink-200 bg-ink-100 focus-visible:outline-2 focus-visible:outline-lichen-700"
      >
        {url ? (
          // eslint-disable-next-line @next/next/no-img-element -- presigned links, not optimisable
          <img src={url} alt={photo.caption || "Photo"} className="h-full w-full object-cover" />
        ) : (
          <span className="flex h-full w-full flex-col items-center justify-center gap-1 p-1 text-center text-xs font-semibold text-ink-700">
            <Hourglass className="h-5 w-5" aria-hidden="true" />
            {photo.storedAt ? "Loading" : "Still on a field device"}
          </span>
        )}
      </button>
      {photo.caption ? <p className="mt-1 line-clamp-2 break-words text-xs text-ink-800">{photo.caption}</p> : null}
    </li>
  );
}

export function StoredPhotos({ projectId, photos, title }: { projectId: string; photos: StoredPhoto[]; title?: string }) {
  const [open, setOpen] = useState<string | null>(null);
  if (photos.length === 0) return null;
  return (
    <div className="mt-2" data-testid="stored-photos">
      {title ? <h3 className="mb-1 text-sm font-bold text-ink-900">{title}</h3> : null}
      <ul className="grid grid-cols-4 gap-2 sm:grid-cols-6 lg:grid-cols-8">
        {photos.map((photo) => (
          <Thumb key={photo.id} projectId={projectId} photo={photo} onOpen={setOpen} />
        ))}
      </ul>
      {open ? (
        <div role="dialog" aria-modal="true" aria-label="Photo, full size" className="fixed inset-0 z-50 flex items-center justify-center bg-ink-950 p-4" onClick={() => setOpen(null)}>
          <button type="button" onClick={() => setOpen(null)} className="absolute right-3 top-3 rounded-md bg-white/10 p-2 text-white" aria-label="Close">
            <X className="h-6 w-6" aria-hidden="true" />
          </button>
          {/* eslint-disable-next-line @next/next/no-img-element -- presigned link */}
          <img src={open} alt="Photo, full size" className="max-h-full max-w-full object-contain" />
        </div>
      ) : null}
    </div>
  );
}
