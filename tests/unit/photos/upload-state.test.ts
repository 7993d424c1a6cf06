import { describe, expect, it } from "vitest";
import { isDue, nextUpload, photoBadge, recoverStale, retryDelayMs, UploadTransitionError, type UploadFields } from "@/lib/photos/client/upload-state";

const queued: UploadFields = { uploadState: "queued", attempts: 0, lastError: null, nextAttemptAt: null };

describe("upload state machine: queued → uploading → stored / failed (SYNC.md \"Photos\")", () => {
  it("goes queued → uploading → stored, counting the attempt", () => {
    const up = nextUpload(queued, { type: "start" });
    expect(up).toMatchObject({ uploadState: "uploading", attempts: 1 });
    expect(nextUpload(up, { type: "stored" })).toMatchObject({ uploadState: "stored", attempts: 1, lastError: null });
  });

  it("a failure keeps the message and schedules the retry after the back-off; the retry starts from failed", () => {
    const up = nextUpload(queued, { type: "start" });
    const failed = nextUpload(up, { type: "error", message: "No connection", at: 10_000, random: 1 });
    expect(failed).toMatchObject({ uploadState: "failed", lastError: "No connection", nextAttemptAt: 12_000 });
    expect(isDue(failed, 11_999)).toBe(false);
    expect(isDue(failed, 12_000)).toBe(true);
    const again = nextUpload(failed, { type: "start" });
    expect(again).toMatchObject({ uploadState: "uploading", attempts: 2 });
  });

  it("a permanent refusal is never retried on its own", () => {
    const up = nextUpload(queued, { type: "start" });
    const refused = nextUpload(up, { type: "error", message: "Only JPEG…", permanent: true, at: 0, random: 0.5 });
    expect(refused.nextAttemptAt).toBeNull();
    expect(isDue(refused, Number.MAX_SAFE_INTEGER)).toBe(false);
  });

  it("refuses transitions that make no sense", () => {
    expect(() => nextUpload({ ...queued, uploadState: "stored" }, { type: "start" })).toThrow(UploadTransitionError);
    expect(() => nextUpload({ ...queued, uploadState: "uploading" }, { type: "start" })).toThrow(UploadTransitionError);
    expect(() => nextUpload(queued, { type: "error", message: "x", at: 0, random: 0 })).toThrow(UploadTransitionError);
    // Stored twice is still stored (a second "complete" is a no-op on the server too).
    const stored = { ...queued, uploadState: "stored" as const };
    expect(nextUpload(stored, { type: "stored" })).toBe(stored);
  });

  it("an upload left running by a closed tab is queued again", () => {
    expect(recoverStale({ ...queued, uploadState: "uploading", attempts: 3 })).toMatchObject({ uploadState: "queued", attempts: 3 });
    expect(recoverStale(queued)).toBe(queued);
  });

  it("back-off doubles from 2 s to at most 5 min, jittered between half and the whole step [common practice]", () => {
    expect(retryDelayMs(1, 1)).toBe(2_000);
    expect(retryDelayMs(1, 0)).toBe(1_000);
    expect(retryDelayMs(2, 1)).toBe(4_000);
    expect(retryDelayMs(5, 1)).toBe(32_000);
    expect(retryDelayMs(9, 1)).toBe(300_000); // 2 s × 2⁸ = 512 s, capped at 300 s
    expect(retryDelayMs(30, 0.5)).toBe(225_000);
  });

  it("says in words what each photo is doing", () => {
    expect(photoBadge({ storedAt: "2026-11-16T15:00:00Z" }, undefined).label).toBe("Stored");
    expect(photoBadge({ storedAt: null }, undefined).label).toBe("Uploading from another device");
    expect(photoBadge({ storedAt: null }, { uploadState: "queued" }).label).toBe("Saved on this device");
    // The thumbnail's words fit a 390 px phone's three-column grid [common practice: ~9 characters at 12 px].
    for (const badge of [
      photoBadge({ storedAt: null }, { uploadState: "queued" }),
      photoBadge({ storedAt: null }, undefined),
      photoBadge({ storedAt: null }, { uploadState: "uploading" }, 0.456),
      photoBadge({ storedAt: null }, { uploadState: "failed", lastError: "x" }),
    ]) expect(badge.short.length).toBeLessThanOrEqual(9);
    expect(photoBadge({ storedAt: null }, { uploadState: "uploading" }, 0.456).short).toBe("46 %");
    expect(photoBadge({ storedAt: null }, { uploadState: "uploading" }, 0.456).label).toBe("Uploading 46 %");
    expect(photoBadge({ storedAt: null }, { uploadState: "failed", lastError: "No connection" })).toMatchObject({ label: "Upload failed", detail: "No connection" });
  });
});
