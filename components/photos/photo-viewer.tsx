"use client";

// The full-size view of one photo: from storage when online, else from this device.
import { Hourglass, ImageOff, X } from "lucide-react";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { formatBytes } from "@/lib/photos/client/rules";
import { photoBadge } from "@/lib/photos/client/upload-state";
import { updateLocal, type BlobRow, type LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { PhotoStateBadge } from "./photo-badge";
import { usePhotoSource } from "./use-photo-source";

function formatTaken(value: unknown, timeZone?: string): string | null {
  if (typeof value !== "string" || !value) return null;
  const date = new Date(value);
  if (Number.isNaN(date.getTime())) return null;
  return date.toLocaleString(undefined, { timeZone, weekday: "short", day: "numeric", month: "short", hour: "numeric", minute: "2-digit" });
}

export function PhotoViewer({
  photo,
  blob,
  progress,
  canEdit,
  timeZone,
  onClose,
}: {
  photo: LocalRecord<"photos">;
  blob: BlobRow | undefined;
  progress?: number;
  canEdit: boolean;
  timeZone?: string;
  onClose: () => void;
}) {
  const db = useSyncDb();
  const source = usePhotoSource(photo, blob, "full");
  const badge = photoBadge(photo, blob, progress);
  const closeRef = useRef<HTMLButtonElement>(null);
  const caption = typeof photo.caption === "string" ? photo.caption : "";
  const [draft, setDraft] = useState(caption);
  const [message, setMessage] = useState<string | null>(null);
  const taken = formatTaken(photo.takenAt ?? photo.createdAt, timeZone);

  useEffect(() => {
    closeRef.current?.focus();
    const escape = (e: KeyboardEvent) => e.key === "Escape" && onClose();
    document.addEventListener("keydown", escape);
    return () => document.removeEventListener("keydown", escape);
  }, [onClose]);

  async function saveCaption() {
    try {
      await updateLocal(db, "photos", photo.id, { caption: draft });
      setMessage("Caption saved on this device.");
    } catch (error) {
      setMessage(error instanceof Error ? error.message : "The caption could not be saved.");
    }
  }

  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label={caption || "Photo"}
      data-testid="photo-viewer"
      className="fixed inset-0 z-50 flex flex-col bg-ink-950 text-white"
      onClick={(e) => e.target === e.currentTarget && onClose()}
    >
      <div className="flex items-center justify-between gap-2 p-2">
        <PhotoStateBadge badge={badge} />
        <button
          ref={closeRef}
          type="button"
          onClick={onClose}
          className="inline-flex min-h-11 min-w-11 items-center justify-center rounded-md hover:bg-white/10 focus-visible:outline-2 focus-visible:outline-white"
        >
          <X className="h-6 w-6" aria-hidden="true" />
          <span className="sr-only">Close</span>
        </button>
      </div>
      <div className="flex min-h-0 flex-1 items-center justify-center px-2" onClick={(e) => e.target === e.currentTarget && onClose()}>
        {source.src ? (
          // eslint-disable-next-line @next/next/no-img-element -- object URLs and presigned links
          <img src={source.src} alt={caption || "Photo"} data-testid="photo-full" data-source={source.from ?? "none"} className="max-h-full max-w-full object-contain" />
        ) : (
          <p className="flex flex-col items-center gap-2 text-center text-base">
            {badge.state === "elsewhere" ? <Hourglass className="h-10 w-10" aria-hidden="true" /> : <ImageOff className="h-10 w-10" aria-hidden="true" />}
            {badge.state === "elsewhere" ? "This photo is still uploading from another device." : "The full photo needs a connection."}
          </p>
        )}
      </div>
      <div className="space-y-2 bg-ink-950 p-3 text-sm">
        {source.from === "device" && !source.fullOnDevice ? <p>Showing the small copy kept on this device; the full photo needs a connection.</p> : null}
        <p className="text-ink-200">
          {taken ? `Taken ${taken}` : null}
          {typeof photo.sizeBytes === "number" ? ` · ${formatBytes(photo.sizeBytes)}` : null}
        </p>
        {canEdit ? (
          <div className="rounded-lg bg-white p-2 text-ink-950">
            <Field label="Caption" value={draft} maxLength={500} onChange={(e) => setDraft(e.target.value)} data-testid="photo-caption-edit" />
            <div className="mt-2 flex items-center gap-2">
              <Button variant="secondary" onClick={() => void saveCaption()} disabled={draft.trim() === caption.trim()}>
                Save caption
              </Button>
              {message ? <span role="status">{message}</span> : null}
            </div>
          </div>
        ) : caption ? (
          <p className="text-base">{caption}</p>
        ) : null}
      </div>
    </div>
  );
}
