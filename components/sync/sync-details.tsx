"use client";

import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { createPortal } from "react-dom";
import { CircleAlert, HardDrive, LogIn, RefreshCw, X } from "lucide-react";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { RECONCILE_WORDS } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { listConflicts, listOutbox, dismissRejection } from "@/lib/sync/client/queries";
import { useOptionalSyncDb, usePhotoProgress, useRequestSync, type SyncState } from "@/lib/sync/client/react";
import { photoBadge } from "@/lib/photos/client/upload-state";
import { describeConflict, describeEntry, describeSince, plural } from "@/lib/sync/client/words";
import { useNow } from "./use-now";

const SHOWN = 20;

function formatTime(iso: string): string {
  const date = new Date(iso);
  return date.toLocaleString(undefined, { weekday: "short", hour: "2-digit", minute: "2-digit" });
}

/** Where the panel hangs on a wider screen: under the status control, right-aligned with it. */
export type SyncAnchor = { topPx: number; rightPx: number };

/**
 * The sheet behind the sync status control: waiting changes, refusals and errors, in words. On a
 * phone a bottom sheet over a backdrop, inside the viewport whatever the header's layout; from the
 * `sm` width up a panel under the control. Rendered into the body so no header box can clip it.
 */
export function SyncDetails({ state, onClose, anchor, sheetRef }: { state: SyncState; onClose: () => void; anchor: SyncAnchor; sheetRef: React.Ref<HTMLDivElement> }) {
  return createPortal(
    <>
      <div aria-hidden="true" data-testid="sync-details-backdrop" className="fixed inset-0 z-40 bg-ink-950/50 sm:hidden" onClick={onClose} />
      <div
        ref={sheetRef}
        role="dialog"
        aria-label="Sync details"
        data-testid="sync-details"
        style={{ "--sync-top": `${anchor.topPx}px`, "--sync-right": `${anchor.rightPx}px` } as React.CSSProperties}
        className={clsx(
          "fixed inset-x-0 bottom-0 z-50 max-h-[85dvh] overflow-y-auto rounded-t-2xl border-t border-ink-200 bg-white p-4 pb-[max(1rem,env(safe-area-inset-bottom))] text-left text-ink-900 shadow-xl",
          "sm:inset-x-auto sm:bottom-auto sm:right-[var(--sync-right)] sm:top-[var(--sync-top)] sm:max-h-[75dvh] sm:w-[22rem] sm:rounded-lg sm:border sm:p-3 sm:shadow-lg",
        )}
      >
        <DetailsBody state={state} onClose={onClose} />
      </div>
    </>,
    document.body,
  );
}

function DetailsBody({ state, onClose }: { state: SyncState; onClose: () => void }) {
  const db = useOptionalSyncDb();
  const requestSync = useRequestSync();
  const now = useNow();
  const outbox = useLiveQuery(() => (db ? listOutbox(db) : []), [db]) ?? [];
  const rejected = useLiveQuery(() => (db ? listConflicts(db, "rejected") : []), [db]) ?? [];
  const photoRows = useLiveQuery(() => (db ? db.blobs.where("uploadState").notEqual("stored").toArray() : []), [db]) ?? [];
  const progress = usePhotoProgress();

  return (
    <>
      <div className="flex items-center justify-between gap-2">
        <h2 className="text-lg font-bold">Sync</h2>
        <button
          type="button"
          onClick={onClose}
          data-testid="sync-details-close"
          className="-mr-2 inline-flex min-h-touch min-w-touch items-center justify-center rounded-md hover:bg-ink-100"
        >
          <X className="h-5 w-5" aria-hidden="true" />
          <span className="sr-only">Close</span>
        </button>
      </div>

      <p className="text-sm" data-testid="sync-last">
        Last successful sync:{" "}
        {state.lastSyncAt ? (
          <>
            <strong>{now ? describeSince(state.lastSyncAt, now) : formatTime(state.lastSyncAt)}</strong>
            {now ? <span className="text-muted"> ({formatTime(state.lastSyncAt)})</span> : null}
          </>
        ) : (
          <strong>not yet on this device</strong>
        )}
      </p>
      <p className="mt-1 text-sm">
        {state.online ? "Connected." : "Offline: changes are saved on this device and sent when the connection is back."}
      </p>

      {state.needsSignIn ? (
        <p className="mt-3 flex gap-2 rounded-md border-2 border-caution-600 bg-caution-50 p-2 text-sm text-caution-800">
          <LogIn className="mt-0.5 h-4 w-4 shrink-0" aria-hidden="true" />
          <span>
            Sign in again to sync. Your changes stay on this device.{" "}
            <Link href="/signin" className="font-semibold underline">
              Sign in
            </Link>
          </span>
        </p>
      ) : state.lastError ? (
        <p className="mt-3 flex gap-2 rounded-md border-2 border-caution-600 bg-caution-50 p-2 text-sm text-caution-800" data-testid="sync-error">
          <CircleAlert className="mt-0.5 h-4 w-4 shrink-0" aria-hidden="true" />
          <span>
            <span className="sr-only">Problem: </span>
            {state.lastError}
          </span>
        </p>
      ) : null}

      {state.storageWarning ? (
        <p className="mt-3 flex gap-2 rounded-md border-2 border-caution-600 bg-caution-50 p-2 text-sm text-caution-800">
          <HardDrive className="mt-0.5 h-4 w-4 shrink-0" aria-hidden="true" />
          <span>{state.storageWarning}</span>
        </p>
      ) : null}

      {state.conflicts > 0 ? (
        <Link
          href="/field/conflicts"
          onClick={onClose}
          className="mt-3 flex min-h-touch items-center gap-2 rounded-md border-2 border-danger-600 bg-danger-50 px-2 text-sm font-semibold text-danger-800"
        >
          <VocabularyIcon name={RECONCILE_WORDS.icon} />
          {plural(state.conflicts, "change")} {RECONCILE_WORDS.label.toLowerCase()}
        </Link>
      ) : null}

      {rejected.length > 0 ? (
        <section className="mt-3">
          <h3 className="text-sm font-bold">Refused by the server ({rejected.length})</h3>
          <p className="text-xs text-muted">The server kept a copy of each; the office can see it.</p>
          <ul className="mt-1 space-y-1">
            {rejected.map((row) => (
              <li key={row.id} className="flex items-start gap-2 rounded-md bg-ink-50 p-2 text-sm">
                <span className="flex-1">{describeConflict(row)}</span>
                <button
                  type="button"
                  onClick={() => db && void dismissRejection(db, row.id)}
                  className="min-h-touch min-w-touch rounded-md px-2 text-sm font-semibold text-ink-800 hover:bg-ink-100"
                >
                  Dismiss
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section className="mt-3">
        <h3 className="text-sm font-bold">
          {outbox.length === 0 ? "No changes waiting" : `Waiting to be sent (${outbox.length})`}
        </h3>
        {outbox.length > 0 ? (
          <ul className="mt-1 space-y-1" data-testid="sync-waiting-list">
            {outbox.slice(0, SHOWN).map((entry) => (
              <li key={entry.mutationId} className="rounded-md bg-ink-50 p-2 text-sm">
                <span className="font-semibold">{describeEntry(entry)}</span>
                <span className="block text-xs text-muted">
                  {entry.state === "sending" ? "Sending…" : entry.state === "failed" ? "Not sent yet: will try again" : "Waiting"}
                  {now ? ` · saved ${describeSince(entry.createdAt, now)}` : ""}
                  {entry.attempts > 0 ? ` · ${plural(entry.attempts, "attempt")}` : ""}
                </span>
                {entry.lastError && entry.state === "failed" ? <span className="block text-xs">{entry.lastError}</span> : null}
              </li>
            ))}
            {outbox.length > SHOWN ? <li className="text-sm text-muted">and {outbox.length - SHOWN} more</li> : null}
          </ul>
        ) : null}
      </section>

      {photoRows.length > 0 ? (
        <section className="mt-3">
          <h3 className="text-sm font-bold">Photos to upload ({photoRows.length})</h3>
          <p className="text-xs text-muted">Photos travel apart from the changes; the records are not held up by them.</p>
          <ul className="mt-1 space-y-1" data-testid="sync-photo-list">
            {photoRows.slice(0, SHOWN).map((row) => {
              const badge = photoBadge({ storedAt: null }, row, progress.get(row.id));
              return (
                <li key={row.id} className="rounded-md bg-ink-50 p-2 text-sm">
                  <span className="font-semibold">{badge.label}</span>
                  <span className="block text-xs text-muted">
                    {Math.max(1, Math.round(row.size / 1024))} kB{now ? ` · taken ${describeSince(row.createdAt, now)}` : ""}
                    {row.attempts > 0 ? ` · ${plural(row.attempts, "attempt")}` : ""}
                  </span>
                  {row.uploadState === "failed" && row.lastError ? <span className="block text-xs">{row.lastError}</span> : null}
                </li>
              );
            })}
          </ul>
        </section>
      ) : null}

      <button
        type="button"
        onClick={requestSync}
        data-testid="sync-now"
        disabled={state.syncing}
        className="mt-3 inline-flex min-h-touch w-full items-center justify-center gap-2 rounded-lg border border-ink-300 bg-white px-4 font-semibold hover:bg-ink-50 disabled:opacity-50"
      >
        <RefreshCw className={`h-4 w-4 ${state.syncing ? "motion-safe:animate-spin" : ""}`} aria-hidden="true" />
        {state.syncing ? "Syncing…" : "Sync now"}
      </button>
    </>
  );
}
