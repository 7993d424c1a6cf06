import "fake-indexeddb/auto";
import { renderToString } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SyncStatus, syncLook } from "@/components/shell/sync-status";
import type { SyncState } from "@/lib/sync/client/react";
import { describeEntry, describeSince } from "@/lib/sync/client/words";

const base: SyncState = {
  available: true,
  online: true,
  syncing: false,
  leader: true,
  needsSignIn: false,
  storageWarning: null,
  persisted: true,
  loading: false,
  waiting: 0,
  failed: 0,
  conflicts: 0,
  rejected: 0,
  photosWaiting: 0,
  photosFailed: 0,
  lastSyncAt: "2026-11-09T11:55:00.000Z",
  lastError: null,
};
const NOW = Date.parse("2026-11-09T12:00:00.000Z");

describe("sync status in words", () => {
  it("says Offline / Syncing / N waiting / All saved, never by colour alone", () => {
    expect(syncLook({ ...base, online: false, waiting: 3 }, NOW)).toMatchObject({ label: "Offline", detail: "3 changes waiting" });
    expect(syncLook({ ...base, online: false }, NOW)).toMatchObject({ label: "Offline", detail: "All saved on this device" });
    expect(syncLook({ ...base, syncing: true, waiting: 1 }, NOW)).toMatchObject({ label: "Syncing", detail: "1 change waiting" });
    expect(syncLook({ ...base, waiting: 2 }, NOW)).toMatchObject({ label: "2 waiting" });
    expect(syncLook({ ...base, waiting: 2, failed: 1 }, NOW)).toMatchObject({ label: "2 waiting", detail: "Sync problem: tap for details" });
    expect(syncLook(base, NOW)).toMatchObject({ label: "All saved", detail: "last sync 5 min ago" });
    expect(syncLook({ ...base, needsSignIn: true, waiting: 4 }, NOW)).toMatchObject({ label: "Sign in to sync" });
  });

  it("counts photos still to upload apart from the changes (the photo lane)", () => {
    expect(syncLook({ ...base, online: false, waiting: 1, photosWaiting: 2 }, NOW)).toMatchObject({ label: "Offline", detail: "1 change waiting, 2 photos to upload" });
    expect(syncLook({ ...base, photosWaiting: 1 }, NOW)).toMatchObject({ label: "1 photo uploading", detail: "1 photo to upload" });
    expect(syncLook({ ...base, photosWaiting: 2, photosFailed: 1 }, NOW)).toMatchObject({ label: "2 photos waiting", detail: "Photo upload problem: tap for details" });
    expect(syncLook({ ...base, waiting: 3, photosWaiting: 2 }, NOW)).toMatchObject({ label: "3 waiting", detail: "3 changes waiting, 2 photos to upload" });
  });

  it("describes changes and times in words", () => {
    expect(describeEntry({ name: "create", recordType: "deliveries", args: {} })).toBe("Delivery (new)");
    expect(describeEntry({ name: "transition", recordType: "placements", args: { to: "ready" } })).toBe("Placement (state change → ready)");
    expect(describeSince("2026-11-09T11:59:40.000Z", NOW)).toBe("just now");
    expect(describeSince("2026-11-09T09:00:00.000Z", NOW)).toBe("3 h ago");
    expect(describeSince(null, NOW)).toBe("never");
  });

  it("renders online/offline only where no SyncProvider is above", () => {
    const html = renderToString(<SyncStatus />);
    expect(html).toContain('data-testid="sync-status"');
    expect(html).toContain("Online");
    expect(html).not.toContain("waiting");
  });
});
