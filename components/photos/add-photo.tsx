"use client";

// Camera or gallery → checked, compressed, hashed and kept on this device with its metadata queued.
import { Camera, ImagePlus } from "lucide-react";
import { useId, useRef, useState } from "react";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PhotoInputError, preparePhoto, savePhoto } from "@/lib/photos/client/capture";
import { formatBytes, INPUT_ACCEPT, inputProblem } from "@/lib/photos/client/rules";
import type { PhotoTarget } from "@/lib/photos/rules";
import { isLocalWriteError } from "@/lib/sync/client";
import { useOnline, useSyncDb } from "@/lib/sync/client/react";

/** The time the photo was taken: the file's own time when it is plausible, else now. */
function takenAtOf(file: File, now = Date.now()): string {
  const t = file.lastModified;
  return Number.isFinite(t) && t > Date.UTC(2000, 0, 1) && t <= now + 60_000 ? new Date(t).toISOString() : new Date(now).toISOString();
}

type Status = { tone: "info" | "success" | "danger"; text: string } | null;

const pick =
  "inline-flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border border-ink-300 bg-white px-4 text-base font-semibold text-ink-900 hover:bg-ink-50 focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-lichen-700";

export function AddPhoto({ projectId, recordType, recordId }: { projectId: string; recordType: PhotoTarget; recordId: string }) {
  const db = useSyncDb();
  const online = useOnline();
  const id = useId();
  const [caption, setCaption] = useState("");
  const [status, setStatus] = useState<Status>(null);
  const [busy, setBusy] = useState(false);
  const cameraRef = useRef<HTMLInputElement>(null);
  const galleryRef = useRef<HTMLInputElement>(null);

  async function add(files: FileList | null) {
    const list = files ? [...files] : [];
    if (list.length === 0) return;
    // Check every file before any work, so a wrong one says so at once and nothing is stored.
    for (const file of list) {
      const problem = inputProblem(file);
      if (problem) {
        setStatus({ tone: "danger", text: `${file.name}: ${problem}` });
        return;
      }
    }
    setBusy(true);
    let saved = 0;
    let bytes = 0;
    try {
      for (const [index, file] of list.entries()) {
        setStatus({ tone: "info", text: list.length > 1 ? `Compressing photo ${index + 1} of ${list.length}…` : "Compressing the photo…" });
        const prepared = await preparePhoto(file);
        await savePhoto(db, { projectId, recordType, recordId, caption: caption.trim(), takenAt: takenAtOf(file) }, prepared);
        saved += 1;
        bytes += prepared.sizeBytes;
      }
      setCaption("");
      setStatus({
        tone: "success",
        // Online the upload starts at once; only offline does it wait for a connection.
        text: `${saved === 1 ? "Photo" : `${saved} photos`} saved on this device (${formatBytes(bytes)}); ${saved === 1 ? "it" : "they"} ${
          online ? (saved === 1 ? "is uploading now" : "are uploading now") : saved === 1 ? "uploads when there is a connection" : "upload when there is a connection"
        }.`,
      });
    } catch (error) {
      const text =
        error instanceof PhotoInputError || isLocalWriteError(error)
          ? (error as Error).message
          : "The photo could not be saved on this device. Try again; if the device is full, free some space.";
      if (!(error instanceof PhotoInputError) && !isLocalWriteError(error)) console.error("photos: could not save", error);
      setStatus({ tone: "danger", text: saved > 0 ? `${saved} saved; then: ${text}` : text });
    } finally {
      setBusy(false);
      if (cameraRef.current) cameraRef.current.value = "";
      if (galleryRef.current) galleryRef.current.value = "";
    }
  }

  return (
    <div className="mt-3 space-y-2" data-testid="add-photo">
      <Field label="Caption for the next photo (optional)" value={caption} maxLength={500} onChange={(e) => setCaption(e.target.value)} placeholder="e.g. Slump cone, truck 2" data-testid="photo-caption" />
      <div className="flex flex-wrap gap-2">
        <label className={pick} aria-disabled={busy} htmlFor={`${id}-camera`}>
          <Camera className="h-5 w-5" aria-hidden="true" />
          Take photo
          <input
            ref={cameraRef}
            id={`${id}-camera`}
            type="file"
            accept={INPUT_ACCEPT}
            capture="environment"
            disabled={busy}
            className="sr-only"
            data-testid="photo-input-camera"
            onChange={(e) => void add(e.target.files)}
          />
        </label>
        <label className={pick} aria-disabled={busy} htmlFor={`${id}-gallery`}>
          <ImagePlus className="h-5 w-5" aria-hidden="true" />
          From gallery
          <input
            ref={galleryRef}
            id={`${id}-gallery`}
            type="file"
            accept={INPUT_ACCEPT}
            multiple
            disabled={busy}
            className="sr-only"
            data-testid="photo-input-gallery"
            onChange={(e) => void add(e.target.files)}
          />
        </label>
      </div>
      {status ? (
        <Notice tone={status.tone} title={status.text} testId="photo-status" />
      ) : null}
    </div>
  );
}
