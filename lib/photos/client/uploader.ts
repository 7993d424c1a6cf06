// The photo lane on the device (SYNC.md "Photos"): separate from the outbox, so a slow upload never
// holds up the records. For each photo whose metadata the server has (the outbox create was applied):
// presign → PUT the bytes to storage (the Content-Type that was presigned) → complete, where the
// server checks size, type and SHA-256. Failures back off (upload-state.ts). The compressed bytes
// are dropped only once a pull has brought the photo with storedAt set; the thumbnail stays.
// Runs in the tab that leads the sync loop, after each sync cycle and when its back-off ends.
import type { BlobRow, SyncDb } from "@/lib/sync/client/db";
import type { DriverStatus } from "@/lib/sync/client/driver-env";
import type { FetchLike } from "@/lib/sync/client/sync-http";
import { failureOf, UploadFailure, xhrPut, type PutFn } from "./upload-http";
import { isDue, nextUpload, recoverStale, type UploadEvent } from "./upload-state";

export { xhrPut, type PutFn };

type DriverLike = { getStatus: () => DriverStatus; subscribe: (listener: () => void) => () => void; requestSync: () => void };

export type UploaderOptions = {
  db: SyncDb;
  fetch?: FetchLike;
  put?: PutFn;
  now?: () => number;
  random?: () => number;
  setTimeout?: (fn: () => void, ms: number) => unknown;
  clearTimeout?: (handle: unknown) => void;
};

export type RunResult = { stored: number; failed: number; waiting: number; released: number };

export class PhotoUploader {
  private readonly db: SyncDb;
  private readonly fetchFn: FetchLike;
  private readonly put: PutFn;
  private readonly now: () => number;
  private readonly random: () => number;
  private readonly setTimer: (fn: () => void, ms: number) => unknown;
  private readonly clearTimer: (handle: unknown) => void;
  private progress = new Map<string, number>();
  private progressSnapshot: ReadonlyMap<string, number> = new Map();
  private listeners = new Set<() => void>();
  private running: Promise<RunResult> | null = null;
  private again = false;
  private timer: unknown = null;
  private cleanup: (() => void)[] = [];
  private active = false;
  private requestSync: (() => void) | null = null;

  constructor(options: UploaderOptions) {
    this.db = options.db;
    this.fetchFn = options.fetch ?? ((input, init) => globalThis.fetch(input, init));
    this.put = options.put ?? xhrPut;
    this.now = options.now ?? (() => Date.now());
    this.random = options.random ?? (() => Math.random());
    this.setTimer = options.setTimeout ?? ((fn, ms) => globalThis.setTimeout(fn, ms));
    this.clearTimer = options.clearTimeout ?? ((handle) => globalThis.clearTimeout(handle as ReturnType<typeof setTimeout>));
  }

  // progress for React (useSyncExternalStore)

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getProgress = (): ReadonlyMap<string, number> => this.progressSnapshot;

  private setProgress(id: string, fraction: number | null) {
    if (fraction === null) this.progress.delete(id);
    else this.progress.set(id, fraction);
    this.progressSnapshot = new Map(this.progress);
    for (const listener of [...this.listeners]) listener();
  }

  // life cycle: follows the sync driver (runs only in the leading tab, after each cycle)

  attach(driver: DriverLike): () => void {
    let wasSyncing = driver.getStatus().syncing;
    // A photo just stored: sync soon, so the pull brings storedAt (and the bytes here can go).
    this.requestSync = () => driver.requestSync();
    const check = () => {
      const status = driver.getStatus();
      this.active = status.leader;
      if (status.leader && wasSyncing && !status.syncing && status.online) this.kick();
      wasSyncing = status.syncing;
    };
    this.cleanup.push(driver.subscribe(check));
    this.cleanup.push(this.db.onLocalWrite(() => this.kick(2_000)));
    check();
    void this.recover();
    return () => this.detach();
  }

  detach(): void {
    for (const fn of this.cleanup.splice(0)) fn();
    if (this.timer !== null) this.clearTimer(this.timer);
    this.timer = null;
    this.active = false;
    this.requestSync = null;
  }

  /** Rows left "uploading" by a closed tab go back to the queue. */
  private async recover() {
    const stale = await this.db.blobs.where("uploadState").equals("uploading").toArray();
    for (const row of stale) await this.db.blobs.put({ ...row, ...recoverStale(row) });
  }

  /** Runs soon (only in the leading tab). */
  kick(delayMs = 0): void {
    if (!this.active) return;
    if (this.timer !== null) this.clearTimer(this.timer);
    this.timer = this.setTimer(() => {
      this.timer = null;
      void this.runOnce().then((result) => {
        if (result.stored > 0) this.requestSync?.();
        return this.scheduleRetry();
      });
    }, delayMs);
  }

  private async scheduleRetry() {
    if (!this.active || this.timer !== null) return;
    const failed = await this.db.blobs.where("uploadState").equals("failed").toArray();
    const next = Math.min(...failed.map((row) => row.nextAttemptAt ?? Infinity));
    if (Number.isFinite(next)) this.kick(Math.max(0, next - this.now()));
  }

  // one pass

  /** One pass over the photos on this device. Concurrent calls share the running pass (and rerun once). */
  runOnce(): Promise<RunResult> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      let result: RunResult;
      do {
        this.again = false;
        result = await this.pass();
      } while (this.again);
      return result;
    })().finally(() => {
      this.running = null;
    });
    return this.running;
  }

  private async pass(): Promise<RunResult> {
    const result: RunResult = { stored: 0, failed: 0, waiting: 0, released: 0 };
    const rows = await this.db.blobs.toArray();
    for (const row of rows) {
      const record = await this.db.records("photos").get(row.id);
      // A pull has shown it stored: the compressed bytes can go (the thumbnail stays for offline views).
      if (record?.storedAt) {
        if (row.data !== null || row.uploadState !== "stored") {
          await this.db.blobs.update(row.id, { data: null, uploadState: "stored", lastError: null, nextAttemptAt: null });
          result.released += 1;
        }
        continue;
      }
      if (!isDue(row, this.now())) continue;
      if (!record) {
        // No metadata here: waiting in the outbox, or the server refused it (the refusal is listed in sync).
        const waiting = await this.db.outbox.where("[recordType+recordId]").equals(["photos", row.id]).count();
        if (waiting > 0) result.waiting += 1;
        else await this.fail(row, "The server refused this photo's details, so it was not uploaded. It stays on this device.", true);
        continue;
      }
      // The metadata mutation must have been applied before the bytes go (the server then knows the photo).
      if (!record.serverCopy || record.deletedAt || !row.data) {
        result.waiting += 1;
        continue;
      }
      if ((await this.upload(row, record)) === "stored") result.stored += 1;
      else result.failed += 1;
    }
    return result;
  }

  private async transition(row: BlobRow, event: UploadEvent): Promise<BlobRow> {
    const next = { ...row, ...nextUpload(row, event) };
    await this.db.blobs.put(next);
    return next;
  }

  private async fail(row: BlobRow, message: string, permanent: boolean) {
    const uploading = row.uploadState === "uploading" ? row : await this.transition(row, { type: "start" });
    await this.transition(uploading, { type: "error", message, permanent, at: this.now(), random: this.random() });
  }

  private async upload(row: BlobRow, record: Record<string, unknown>): Promise<"stored" | "failed"> {
    const current = await this.transition(row, { type: "start" });
    this.setProgress(row.id, 0);
    const base = `/api/projects/${encodeURIComponent(String(record.projectId))}/photos/${encodeURIComponent(row.id)}`;
    try {
      const presign = await this.request(base, {
        recordType: record.recordType,
        recordId: record.recordId,
        caption: record.caption ?? "",
        takenAt: record.takenAt ?? null,
        contentType: row.contentType,
        sizeBytes: row.size,
        sha256: row.sha256,
      }, "registration");
      const answer = (await presign.json()) as { stored: boolean; uploadUrl?: string; headers?: Record<string, string> };
      if (!answer.stored) {
        const body = row.data instanceof Blob ? row.data : new Blob([row.data as ArrayBuffer], { type: row.contentType });
        let put: { status: number };
        try {
          put = await this.put(answer.uploadUrl!, answer.headers ?? { "content-type": row.contentType }, body, (f) => this.setProgress(row.id, f));
        } catch {
          throw new UploadFailure("No connection to the photo storage: it will try again.", false);
        }
        if (put.status < 200 || put.status >= 300) throw new UploadFailure(`The photo storage answered ${put.status}; it will try again.`, false);
        this.setProgress(row.id, 1);
        await this.request(`${base}/complete`, {}, "check");
      }
      await this.transition(current, { type: "stored" });
      return "stored";
    } catch (error) {
      const failure = error instanceof UploadFailure ? error : new UploadFailure("The upload stopped because of an error on this device; it will try again.", false);
      if (!(error instanceof UploadFailure)) console.error("photos: upload failed", error);
      await this.transition(current, { type: "error", message: failure.message, permanent: failure.permanent, at: this.now(), random: this.random() });
      return "failed";
    } finally {
      this.setProgress(row.id, null);
    }
  }

  private async request(url: string, body: unknown, step: string): Promise<Response> {
    let res: Response;
    try {
      res = await this.fetchFn(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body), credentials: "same-origin" });
    } catch {
      throw new UploadFailure("No connection: the photo uploads when the connection is back.", false);
    }
    if (!res.ok) throw await failureOf(res, step);
    return res;
  }
}

/** Photos on this device still to upload, and of those the ones that failed (for the sync status). */
export async function countPhotoUploads(db: SyncDb): Promise<{ waiting: number; failed: number }> {
  const [total, stored, failed] = await Promise.all([
    db.blobs.count(),
    db.blobs.where("uploadState").equals("stored").count(),
    db.blobs.where("uploadState").equals("failed").count(),
  ]);
  return { waiting: total - stored, failed };
}
