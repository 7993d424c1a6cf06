// One push-then-pull cycle of the sync driver, and the storage checks that follow it: what a cycle
// does, apart from when it runs (timing.ts) and which tab runs it (driver.ts).
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { ensureMeta, getMeta, setMeta, type SyncDb } from "./db";
import type { StorageLike } from "./driver-env";
import { pullAll } from "./pull";
import { pushAll, type FetchLike, type PushOutcome } from "./push";
import { storageWarning, type CycleResult } from "./timing";

export type CycleOutcome = { result: CycleResult; message: string | null };

type CycleOptions = {
  fetch: FetchLike;
  isCurrentUser: () => Promise<boolean>;
  /** Entries left "sending" this long ago are sent again (0: never, when Web Locks keep one sender). */
  recoverSendingAfterMs: number;
};

/** Push, then pull until nothing more. */
export async function runOnce(db: SyncDb, options: CycleOptions): Promise<CycleOutcome> {
  if (!(await options.isCurrentUser())) {
    return { result: "unauthenticated", message: "Someone else is signed in on this device. These changes wait for their owner to sign in." };
  }
  await ensureMeta(db, SYNC_SCHEMA_VERSION);
  const push = await pushAll(db, { fetch: options.fetch, recoverSendingAfterMs: options.recoverSendingAfterMs });
  if (push.kind === "unauthenticated" || push.kind === "transient") return fromPush(push);
  const pull = await pullAll(db, { fetch: options.fetch });
  if (push.kind === "gap" || push.kind === "failed") return fromPush(push);
  if (pull.kind !== "ok") return { result: pull.kind, message: pull.message };
  // Changes written while this cycle ran are sent by the rerun that the scheduler queues.
  return { result: "ok", message: null };
}

/** Keeps the last sync time and problem in meta (shown after a reload). */
export async function recordCycle(db: SyncDb, outcome: CycleOutcome, nowMs: number): Promise<void> {
  try {
    if (outcome.result === "ok") {
      await setMeta(db, "lastSyncAt", new Date(nowMs).toISOString());
      await setMeta(db, "lastError", null);
    } else {
      await setMeta(db, "lastError", outcome.message);
    }
  } catch (error) {
    console.error("sync: could not record the sync state", error);
  }
}

/** Asks once for persistent storage: whether it is granted (null: unknown; undefined: no storage API, or it failed). */
export async function requestPersistence(db: SyncDb, storage: StorageLike | undefined): Promise<boolean | null | undefined> {
  if (!storage) return undefined;
  try {
    let persisted = storage.persisted ? await storage.persisted() : null;
    if (!persisted && storage.persist && !(await getMeta(db, "persistRequested"))) {
      await setMeta(db, "persistRequested", true);
      persisted = await storage.persist();
    }
    return persisted;
  } catch (error) {
    console.warn("sync: persistent storage request failed", error);
    return undefined;
  }
}

/** The free-space warning (null: enough room; undefined: the browser cannot say). */
export async function checkFreeSpace(storage: StorageLike | undefined): Promise<string | null | undefined> {
  const estimate = storage?.estimate;
  if (!estimate) return undefined;
  try {
    return storageWarning(await estimate.call(storage));
  } catch {
    // Some browsers refuse estimate() in private windows; no warning then.
    return undefined;
  }
}

function fromPush(push: PushOutcome): CycleOutcome {
  switch (push.kind) {
    case "idle":
    case "ok":
      return { result: "ok", message: null };
    case "unauthenticated":
      return { result: "unauthenticated", message: push.message };
    case "transient":
      return { result: "transient", message: push.message };
    case "gap":
      return { result: "gap", message: push.message };
    case "failed":
      return { result: "failed", message: push.message };
  }
}
