"use client";

import clsx from "clsx";
import { CloudCheck, CloudUpload, LogIn, RefreshCw, TriangleAlert, Wifi, WifiOff } from "lucide-react";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { RECONCILE_WORDS } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { SyncDetails, type SyncAnchor } from "@/components/sync/sync-details";
import { useNow } from "@/components/sync/use-now";
import { useSyncState, type SyncState } from "@/lib/sync/client/react";
import { describeSince, plural } from "@/lib/sync/client/words";

type Look = { label: string; detail?: string; icon: typeof Wifi; tone: "plain" | "caution" | "danger"; spin?: boolean };

/** What the control says, in words (the icon and colour only repeat it). */
export function syncLook(state: SyncState, now: number): Look {
  const changes = state.waiting > 0 ? plural(state.waiting, "change") + " waiting" : undefined;
  const photos = state.photosWaiting > 0 ? plural(state.photosWaiting, "photo") + " to upload" : undefined;
  const waiting = changes && photos ? `${changes}, ${photos}` : (changes ?? photos);
  if (!state.online) return { label: "Offline", detail: waiting ?? "All saved on this device", icon: WifiOff, tone: "caution" };
  // Until the counts are read, claim nothing about saved changes.
  if (state.loading) return { label: "Online", icon: Wifi, tone: "plain" };
  if (state.needsSignIn) return { label: "Sign in to sync", detail: waiting, icon: LogIn, tone: "caution" };
  if (state.syncing) return { label: "Syncing", detail: waiting, icon: RefreshCw, tone: "plain", spin: true };
  if (state.failed > 0 || (state.lastError && state.waiting > 0)) {
    return { label: `${state.waiting} waiting`, detail: "Sync problem: tap for details", icon: TriangleAlert, tone: "caution" };
  }
  if (state.waiting > 0) return { label: `${state.waiting} waiting`, detail: waiting, icon: CloudUpload, tone: "plain" };
  // The records are saved; photos still travel in their own lane.
  if (state.photosFailed > 0) {
    return { label: plural(state.photosWaiting, "photo") + " waiting", detail: "Photo upload problem: tap for details", icon: TriangleAlert, tone: "caution" };
  }
  if (state.photosWaiting > 0) return { label: plural(state.photosWaiting, "photo") + " uploading", detail: photos, icon: CloudUpload, tone: "plain" };
  if (state.lastError) {
    return { label: "All saved", detail: "Could not fetch the latest records: tap for details", icon: TriangleAlert, tone: "caution" };
  }
  const since = state.lastSyncAt && now ? `last sync ${describeSince(state.lastSyncAt, now)}` : undefined;
  return { label: "All saved", detail: since, icon: CloudCheck, tone: "plain" };
}

function ConnectionOnly({ online }: { online: boolean }) {
  return (
    <span
      data-testid="sync-status"
      className={`inline-flex min-h-11 items-center gap-1.5 rounded-md px-2 text-sm font-semibold ${online ? "text-ink-100" : "bg-caution-100 text-caution-800"}`}
    >
      {online ? <Wifi className="h-4 w-4" aria-hidden="true" /> : <WifiOff className="h-4 w-4" aria-hidden="true" />}
      <span className="hidden sm:inline">{online ? "Online" : "Offline"}</span>
      <span className="sr-only sm:hidden">{online ? "Online" : "Offline"}</span>
    </span>
  );
}

/**
 * The shell's sync control: Offline / Syncing / "N waiting" / "All saved" with the last sync, in
 * words and an icon; conflicts to resolve as a link; a sheet with the waiting changes and errors.
 * Without a SyncProvider above (pages that do not sync) it shows only online/offline.
 */
export function SyncStatus() {
  const state = useSyncState();
  const now = useNow();
  const [anchor, setAnchor] = useState<SyncAnchor | null>(null);
  const open = anchor !== null;
  const ref = useRef<HTMLDivElement>(null);
  const sheet = useRef<HTMLDivElement>(null);
  const setOpen = (on: boolean) => {
    const box = ref.current?.getBoundingClientRect();
    setAnchor(on && box ? { topPx: box.bottom + 8, rightPx: Math.max(12, window.innerWidth - box.right) } : null);
  };

  useEffect(() => {
    if (!open) return;
    // The sheet is rendered into the body: a press inside it is not "outside".
    const inside = (t: Node) => ref.current?.contains(t) || sheet.current?.contains(t);
    const close = (e: MouseEvent) => !inside(e.target as Node) && setAnchor(null);
    const escape = (e: KeyboardEvent) => e.key === "Escape" && setAnchor(null);
    document.addEventListener("mousedown", close);
    document.addEventListener("keydown", escape);
    return () => {
      document.removeEventListener("mousedown", close);
      document.removeEventListener("keydown", escape);
    };
  }, [open]);

  if (!state.available) return <ConnectionOnly online={state.online} />;

  const look = syncLook(state, now);
  const Icon = look.icon;
  return (
    <div className="relative flex items-center gap-1" ref={ref}>
      {state.conflicts > 0 ? (
        <Link
          href="/field/conflicts"
          prefetch={false}
          data-testid="sync-conflicts"
          className="inline-flex min-h-touch items-center gap-1.5 rounded-md bg-danger-50 px-2 text-sm font-semibold text-danger-800"
        >
          <VocabularyIcon name={RECONCILE_WORDS.icon} />
          {state.conflicts} {RECONCILE_WORDS.label.toLowerCase()}
        </Link>
      ) : null}
      <button
        type="button"
        data-testid="sync-status"
        data-state={look.label}
        aria-expanded={open}
        aria-haspopup="dialog"
        onClick={() => setOpen(!open)}
        title={look.detail}
        className={clsx(
          "inline-flex min-h-touch min-w-touch items-center justify-center gap-1.5 rounded-md px-2 text-sm font-semibold",
          look.tone === "plain" && "text-ink-100 hover:bg-white/10",
          look.tone === "caution" && "bg-caution-100 text-caution-800",
          look.tone === "danger" && "bg-danger-50 text-danger-800",
        )}
      >
        <Icon className={clsx("h-4 w-4", look.spin && "motion-safe:animate-spin")} aria-hidden="true" />
        <span className="hidden sm:inline">{look.label}</span>
        <span className="sr-only sm:hidden">{look.label}</span>
        {look.detail ? <span className="sr-only">. {look.detail}</span> : null}
        {/* On a phone the count stays visible beside the icon. */}
        {state.waiting + state.photosWaiting > 0 ? (
          <span aria-hidden="true" className="sm:hidden">
            {state.waiting + state.photosWaiting}
          </span>
        ) : null}
      </button>
      {anchor ? <SyncDetails state={state} anchor={anchor} sheetRef={sheet} onClose={() => setAnchor(null)} /> : null}
    </div>
  );
}
