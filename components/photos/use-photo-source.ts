"use client";

// Where a photo's picture comes from: online and stored → a short-lived presigned GET from the
// server; otherwise the bytes on this device (the compressed photo, or its thumbnail).
import { useEffect, useMemo, useState } from "react";
import type { BlobRow, LocalRecord } from "@/lib/sync/client";
import { useOnline } from "@/lib/sync/client/react";

// Presigned links last 5 minutes (lib/photos/storage.ts presignGet); reuse one for 4.
const LINK_MS = 4 * 60_000;
const links = new Map<string, { url: string; until: number }>();
const pending = new Map<string, Promise<string | null>>();

export async function presignedViewUrl(projectId: string, photoId: string): Promise<string | null> {
  const cached = links.get(photoId);
  if (cached && cached.until > Date.now()) return cached.url;
  const running = pending.get(photoId);
  if (running) return running;
  const request = (async () => {
    try {
      const res = await fetch(`/api/projects/${encodeURIComponent(projectId)}/photos/${encodeURIComponent(photoId)}`, { credentials: "same-origin" });
      if (!res.ok) return null;
      const body = (await res.json()) as { stored: boolean; url?: string };
      if (!body.stored || !body.url) return null;
      links.set(photoId, { url: body.url, until: Date.now() + LINK_MS });
      return body.url;
    } catch {
      return null;
    } finally {
      pending.delete(photoId);
    }
  })();
  pending.set(photoId, request);
  return request;
}

/** An object URL for a stored Blob, revoked when it is no longer shown. */
function useObjectUrl(data: Blob | ArrayBuffer | null | undefined, type: string): string | null {
  const url = useMemo(() => (data ? URL.createObjectURL(data instanceof Blob ? data : new Blob([data], { type })) : null), [data, type]);
  // A short delay: React may run the effect's cleanup and set-up again for the same URL (strict mode).
  useEffect(() => () => void (url && setTimeout(() => URL.revokeObjectURL(url), 30_000)), [url]);
  return url;
}

export type PhotoSource = { src: string | null; from: "storage" | "device" | null; fullOnDevice: boolean };

/** The picture to show: `size` "thumb" prefers the small local thumbnail when not from storage. */
export function usePhotoSource(photo: LocalRecord<"photos">, blob: BlobRow | undefined, size: "thumb" | "full"): PhotoSource {
  const online = useOnline();
  const stored = Boolean(photo.storedAt);
  const [remote, setRemote] = useState<{ id: string; url: string | null } | null>(null);
  const local = useObjectUrl(size === "thumb" ? (blob?.thumb ?? blob?.data) : (blob?.data ?? blob?.thumb), blob?.contentType ?? "image/jpeg");

  useEffect(() => {
    let cancelled = false;
    if (!stored || !online) return;
    void presignedViewUrl(photo.projectId, photo.id).then((url) => {
      if (!cancelled) setRemote({ id: photo.id, url });
    });
    return () => {
      cancelled = true;
    };
  }, [stored, online, photo.projectId, photo.id]);

  const remoteUrl = stored && online && remote?.id === photo.id ? remote.url : null;
  if (remoteUrl) return { src: remoteUrl, from: "storage", fullOnDevice: Boolean(blob?.data) };
  if (local) return { src: local, from: "device", fullOnDevice: Boolean(blob?.data) };
  return { src: null, from: null, fullOnDevice: false };
}
