import "fake-indexeddb/auto";
import { afterEach, describe, expect, it, vi } from "vitest";
import { savePhoto, sha256Hex, type PreparedPhoto } from "@/lib/photos/client/capture";
import { countPhotoUploads, PhotoUploader, type PutFn } from "@/lib/photos/client/uploader";
import { createLocal } from "@/lib/sync/client/mutate";
import type { SyncDb } from "@/lib/sync/client/db";
import type { DriverStatus } from "@/lib/sync/client/driver";
import type { FetchLike } from "@/lib/sync/client/push";
import { cleanupDbs, freshDb, placementValues, project, PROJECT_ID } from "../sync/helpers";

afterEach(cleanupDbs);

async function prepared(bytes = 4096): Promise<PreparedPhoto> {
  const full = new Blob([new Uint8Array(bytes).map((_, i) => (i * 31) % 256)], { type: "image/jpeg" });
  const thumb = new Blob([new Uint8Array(64)], { type: "image/jpeg" });
  return { full, thumb, sha256: await sha256Hex(full), contentType: "image/jpeg", sizeBytes: full.size };
}

async function withPlacement(db: SyncDb) {
  await db.projects.put(project());
  const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
  return id;
}

const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

/** A server that presigns, takes the PUT and completes; records what it saw. */
function fakeLane(options: { completeStatus?: number; presignStatus?: number } = {}) {
  const calls: string[] = [];
  const puts: { url: string; headers: Record<string, string>; size: number }[] = [];
  const fetch: FetchLike = vi.fn(async (url: string, init?: RequestInit) => {
    calls.push(url);
    if (url.endsWith("/complete")) return options.completeStatus ? json({ error: { message: "not yet" } }, options.completeStatus) : json({ stored: true });
    if (options.presignStatus) return json({ error: { message: "Only JPEG, PNG or WebP photos can be added." } }, options.presignStatus);
    const body = JSON.parse(String(init?.body));
    return json({ stored: false, uploadUrl: `http://s3.test/${body.sha256}`, headers: { "content-type": body.contentType } });
  });
  const put: PutFn = vi.fn(async (url, headers, body, onProgress) => {
    onProgress(0.5);
    puts.push({ url, headers, size: body.size });
    return { status: 200 };
  });
  return { fetch, put, calls, puts };
}

describe("capture: the blobs and the metadata mutation in one Dexie transaction", () => {
  it("stores the photo, its thumbnail, the record and its outbox entry together", async () => {
    const db = await freshDb();
    const placementId = await withPlacement(db);
    const photo = await prepared();
    const { id } = await savePhoto(db, { projectId: PROJECT_ID, recordType: "placements", recordId: placementId, caption: "Rebar before the pour" }, photo);
    const blob = await db.blobs.get(id);
    expect(blob).toMatchObject({ uploadState: "queued", sha256: photo.sha256, size: 4096, contentType: "image/jpeg" });
    expect(blob?.thumb).toBeTruthy();
    expect(await db.records("photos").get(id)).toMatchObject({ recordId: placementId, caption: "Rebar before the pour", storedAt: null, pending: 1 });
    const entry = (await db.outbox.toArray()).find((e) => e.recordType === "photos");
    expect(entry?.args).toMatchObject({ id, sha256: photo.sha256, sizeBytes: 4096, contentType: "image/jpeg", recordType: "placements" });
    expect(entry?.args).not.toHaveProperty("storedAt");
  });

  it("an invalid photo writes neither the blob nor the record", async () => {
    const db = await freshDb();
    const photo = await prepared();
    await expect(savePhoto(db, { projectId: PROJECT_ID, recordType: "placements", recordId: "not-an-id" }, photo)).rejects.toThrow();
    expect(await db.blobs.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it("a signed placement takes no photo on the device either", async () => {
    const db = await freshDb();
    const placementId = await withPlacement(db);
    await db.records("placements").update(placementId, { state: "signed" });
    await expect(savePhoto(db, { projectId: PROJECT_ID, recordType: "placements", recordId: placementId }, await prepared())).rejects.toThrow(/amendment/);
    expect(await db.blobs.count()).toBe(0);
  });
});

describe("upload lane", () => {
  async function captured() {
    const db = await freshDb();
    const placementId = await withPlacement(db);
    const { id } = await savePhoto(db, { projectId: PROJECT_ID, recordType: "placements", recordId: placementId }, await prepared());
    return { db, id };
  }
  /** What a push answered "applied" leaves: the record has a server copy. */
  const acknowledge = async (db: SyncDb, id: string) => {
    const row = await db.records("photos").get(id);
    await db.records("photos").put({ ...row!, serverCopy: { ...row!, version: 1 } as never });
  };

  it("waits until the metadata is on the server; then presign, PUT with the presigned type, complete → stored", async () => {
    const { db, id } = await captured();
    const lane = fakeLane();
    const uploader = new PhotoUploader({ db, fetch: lane.fetch, put: lane.put, now: () => 0, random: () => 0 });
    expect(await uploader.runOnce()).toMatchObject({ stored: 0, waiting: 1 });
    expect(lane.calls).toEqual([]);
    expect(await countPhotoUploads(db)).toEqual({ waiting: 1, failed: 0 });

    await acknowledge(db, id);
    expect(await uploader.runOnce()).toMatchObject({ stored: 1 });
    expect(lane.calls).toEqual([`/api/projects/${PROJECT_ID}/photos/${id}`, `/api/projects/${PROJECT_ID}/photos/${id}/complete`]);
    expect(lane.puts).toEqual([{ url: expect.stringContaining("http://s3.test/"), headers: { "content-type": "image/jpeg" }, size: 4096 }]);
    const row = await db.blobs.get(id);
    expect(row?.uploadState).toBe("stored");
    // The bytes stay until a pull shows the photo stored.
    expect(row?.data).not.toBeNull();
    expect(await countPhotoUploads(db)).toEqual({ waiting: 0, failed: 0 });

    await db.records("photos").update(id, { storedAt: "2026-11-16T15:00:00.000Z" });
    expect(await uploader.runOnce()).toMatchObject({ released: 1 });
    const after = await db.blobs.get(id);
    expect(after?.data).toBeNull();
    expect(after?.thumb).toBeTruthy();
    // Nothing more is sent for a stored photo.
    await uploader.runOnce();
    expect(lane.calls).toHaveLength(2);
  });

  it("a failure backs off and is retried when due; a refusal (400) is not retried", async () => {
    const { db, id } = await captured();
    await acknowledge(db, id);
    let now = 1_000;
    const early = fakeLane({ completeStatus: 409 });
    const uploader = new PhotoUploader({ db, fetch: early.fetch, put: early.put, now: () => now, random: () => 1 });
    await uploader.runOnce();
    expect(await db.blobs.get(id)).toMatchObject({ uploadState: "failed", attempts: 1, lastError: "not yet", nextAttemptAt: 3_000 });
    now = 2_000;
    await uploader.runOnce();
    expect(early.calls).toHaveLength(2); // not due yet: nothing sent
    now = 3_000;
    await uploader.runOnce();
    expect(await db.blobs.get(id)).toMatchObject({ uploadState: "failed", attempts: 2, nextAttemptAt: 7_000 });

    const refused = fakeLane({ presignStatus: 400 });
    const second = new PhotoUploader({ db, fetch: refused.fetch, put: refused.put, now: () => 7_000, random: () => 1 });
    await second.runOnce();
    expect(await db.blobs.get(id)).toMatchObject({ uploadState: "failed", nextAttemptAt: null, lastError: expect.stringMatching(/Only JPEG/) });
    expect(await countPhotoUploads(db)).toEqual({ waiting: 1, failed: 1 });
  });

  it("offline (fetch throws), the photo stays queued for later with a plain message", async () => {
    const { db, id } = await captured();
    await acknowledge(db, id);
    const uploader = new PhotoUploader({ db, fetch: async () => Promise.reject(new TypeError("Failed to fetch")), put: vi.fn(), now: () => 0, random: () => 0 });
    await uploader.runOnce();
    expect(await db.blobs.get(id)).toMatchObject({ uploadState: "failed", lastError: expect.stringMatching(/No connection/), nextAttemptAt: 1_000 });
    expect((await db.blobs.get(id))?.data).not.toBeNull();
  });
});

describe("uploader beside the sync driver", () => {
  /** A driver stand-in: status, listeners and a count of requested syncs. */
  function fakeDriver() {
    let status = { leader: true, syncing: true, online: true } as unknown as DriverStatus;
    const listeners = new Set<() => void>();
    const requestSync = vi.fn();
    return {
      requestSync,
      getStatus: () => status,
      subscribe: (listener: () => void) => {
        listeners.add(listener);
        return () => listeners.delete(listener);
      },
      finishCycle() {
        status = { ...status, syncing: false };
        for (const listener of listeners) listener();
      },
    };
  }

  it("uploads after a sync cycle ends and then asks for a sync, so the pull brings storedAt", async () => {
    const db = await freshDb();
    const placementId = await withPlacement(db);
    const { id } = await savePhoto(db, { projectId: PROJECT_ID, recordType: "placements", recordId: placementId }, await prepared());
    const row = await db.records("photos").get(id);
    await db.records("photos").put({ ...row!, serverCopy: { ...row!, version: 1 } as never });
    const lane = fakeLane();
    const timers: (() => void)[] = [];
    const uploader = new PhotoUploader({ db, fetch: lane.fetch, put: lane.put, now: () => 0, random: () => 0, setTimeout: (fn) => timers.push(fn), clearTimeout: () => {} });
    const driver = fakeDriver();
    const detach = uploader.attach(driver);
    driver.finishCycle();
    expect(timers.length).toBeGreaterThan(0);
    timers.splice(0).forEach((fn) => fn());
    await vi.waitFor(() => expect(driver.requestSync).toHaveBeenCalledTimes(1));
    expect((await db.blobs.get(id))?.uploadState).toBe("stored");
    detach();
  });
});
