import "fake-indexeddb/auto";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { getMeta, type SyncDb } from "@/lib/sync/client/db";
import { SyncDriver, type SyncEnv } from "@/lib/sync/client/driver";
import { createLocal } from "@/lib/sync/client/mutate";
import { FakeServer } from "./fake-server";
import { cleanupDbs, freshDb, placementValues, project, PROJECT_ID } from "./helpers";

// Only the timers the driver uses are faked: fake-indexeddb schedules its work with setImmediate.
beforeEach(() => {
  vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout", "setInterval", "clearInterval", "Date"], now: new Date("2026-11-09T12:00:00Z") });
});
afterEach(async () => {
  vi.useRealTimers();
  await cleanupDbs();
});

class FakeDocument extends EventTarget {
  visibilityState = "visible";
  show(state: "visible" | "hidden") {
    this.visibilityState = state;
    this.dispatchEvent(new Event("visibilitychange"));
  }
}

/** A lock manager with the Web Locks semantics the driver needs (exclusive, queued, abortable). */
class FakeLocks {
  private held = new Set<string>();
  private queue: { name: string; grant: () => void }[] = [];
  request(name: string, options: { signal?: AbortSignal }, callback: (lock: unknown) => Promise<unknown>): Promise<unknown> {
    return new Promise((resolve, reject) => {
      const grant = () => {
        this.held.add(name);
        callback({ name }).then(resolve, reject).finally(() => {
          this.held.delete(name);
          const next = this.queue.findIndex((q) => q.name === name);
          if (next >= 0) this.queue.splice(next, 1)[0].grant();
        });
      };
      options.signal?.addEventListener("abort", () => {
        const i = this.queue.findIndex((q) => q.grant === grant);
        if (i >= 0) {
          this.queue.splice(i, 1);
          reject(new DOMException("aborted", "AbortError"));
        }
      });
      if (this.held.has(name)) this.queue.push({ name, grant });
      else grant();
    });
  }
}

/** Tabs of one browser: a shared BroadcastChannel bus. */
function channelBus() {
  const members = new Map<string, Set<{ onmessage: ((e: { data: unknown }) => void) | null }>>();
  return (name: string) => {
    const set = members.get(name) ?? new Set();
    members.set(name, set);
    const channel = {
      onmessage: null as ((e: { data: unknown }) => void) | null,
      postMessage(data: unknown) {
        for (const other of set) if (other !== channel) queueMicrotask(() => other.onmessage?.({ data: structuredClone(data) }));
      },
      close() {
        set.delete(channel);
      },
    };
    set.add(channel);
    return channel;
  };
}

type Setup = {
  db: SyncDb;
  server: FakeServer;
  win: EventTarget;
  doc: FakeDocument;
  navigator: NonNullable<SyncEnv["navigator"]> & { onLine: boolean };
  driver: SyncDriver;
  pushes: () => number;
  pulls: () => number;
};

async function setup(options: { locks?: FakeLocks; channel?: ReturnType<typeof channelBus>; db?: SyncDb; server?: FakeServer; storage?: SyncEnv["navigator"] extends infer N ? N extends { storage?: infer S } ? S : never : never } = {}): Promise<Setup> {
  const db = options.db ?? (await freshDb());
  const server = options.server ?? new FakeServer([project()]);
  let pushes = 0;
  let pulls = 0;
  const fetch = (url: string, init?: RequestInit) => {
    if (url.endsWith("/push")) pushes += 1;
    else pulls += 1;
    return server.fetch(url, init);
  };
  const win = new EventTarget();
  const doc = new FakeDocument();
  const navigator = { onLine: true, locks: options.locks, storage: options.storage };
  const driver = new SyncDriver({
    db,
    fetch,
    isCurrentUser: async () => true,
    env: {
      window: win,
      document: doc,
      navigator,
      createChannel: options.channel,
      now: () => Date.now(),
      random: () => 1,
      setTimeout: (fn, ms) => setTimeout(fn, ms),
      clearTimeout: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
    },
  });
  return { db, server, win, doc, navigator, driver, pushes: () => pushes, pulls: () => pulls };
}

/** Lets timers due within `ms` fire and waits for the cycle they start (IndexedDB runs on real time). */
async function advance(driver: SyncDriver, ms: number) {
  await vi.advanceTimersByTimeAsync(ms);
  await driver.whenIdle();
  await vi.advanceTimersByTimeAsync(0);
  await driver.whenIdle();
}

describe("sync driver", () => {
  it("syncs on start (push then pull), records the time, then every ~30 s", async () => {
    const s = await setup();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    s.driver.start();
    await advance(s.driver, 0);
    expect(s.pushes()).toBe(1);
    expect(s.pulls()).toBe(1);
    expect(await s.db.outbox.count()).toBe(0);
    expect(await getMeta(s.db, "lastSyncAt")).toBe("2026-11-09T12:00:00.000Z");
    expect(s.driver.getStatus()).toMatchObject({ leader: true, syncing: false, lastError: null });
    await advance(s.driver, 29_000);
    expect(s.pulls()).toBe(1);
    await advance(s.driver, 1_000);
    expect(s.pulls()).toBe(2);
    s.driver.stop();
  });

  it("syncs shortly after local writes, once for a burst of writes", async () => {
    const s = await setup();
    s.driver.start();
    await advance(s.driver, 0);
    const before = s.pushes();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues({ element: "A" }));
    await advance(s.driver, 300);
    await createLocal(s.db, "placements", PROJECT_ID, placementValues({ element: "B" }));
    await advance(s.driver, 300);
    await createLocal(s.db, "placements", PROJECT_ID, placementValues({ element: "C" }));
    expect(s.pushes()).toBe(before);
    await advance(s.driver, 400);
    expect(s.pushes()).toBe(before + 1);
    // The burst may straddle the run: whatever came after it goes in the rerun a second later.
    await advance(s.driver, 1_000);
    expect(await s.db.outbox.count()).toBe(0);
    expect(s.server.live("placements")).toHaveLength(3);
    s.driver.stop();
  });

  it("backs off 2 s, 4 s, 8 s … on failures, keeps the changes, and resets on success", async () => {
    const s = await setup();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    s.server.failNext = [503, 503, "network", 503];
    s.driver.start();
    await advance(s.driver, 0);
    expect(s.pushes()).toBe(1);
    expect(s.driver.getStatus().lastError).toMatch(/busy/);
    expect(await getMeta(s.db, "lastError")).toMatch(/busy/);
    await advance(s.driver, 1_999);
    expect(s.pushes()).toBe(1);
    await advance(s.driver, 1);
    expect(s.pushes()).toBe(2);
    await advance(s.driver, 4_000);
    expect(s.pushes()).toBe(3);
    expect(s.driver.getStatus().lastError).toMatch(/No connection/);
    await advance(s.driver, 7_999);
    expect(s.pushes()).toBe(3);
    await advance(s.driver, 1);
    expect(s.pushes()).toBe(4);
    expect(await s.db.outbox.count()).toBe(1);
    await advance(s.driver, 16_000);
    expect(s.pushes()).toBe(5);
    expect(await s.db.outbox.count()).toBe(0);
    expect(s.driver.getStatus().lastError).toBeNull();
    // Reset: the next failure (of the pull: nothing is left to push) waits 2 s again, not 32 s.
    s.server.failNext = [503];
    s.driver.syncNow();
    await advance(s.driver, 0);
    const after = s.pulls();
    expect(s.driver.getStatus().lastError).toMatch(/busy/);
    await advance(s.driver, 1_999);
    expect(s.pulls()).toBe(after);
    await advance(s.driver, 1);
    expect(s.pulls()).toBe(after + 1);
    s.driver.stop();
  });

  it("a write during back-off waits for the back-off; `online` retries at once", async () => {
    const s = await setup();
    s.server.failNext = ["network", "network"];
    s.driver.start();
    await advance(s.driver, 0); // fails: next try in 2 s
    await advance(s.driver, 2_000); // fails: next try in 4 s
    const pulls = s.pulls();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    await advance(s.driver, 1_000);
    expect(s.pulls()).toBe(pulls);
    s.navigator.onLine = true;
    s.win.dispatchEvent(new Event("online"));
    await advance(s.driver, 0);
    expect(s.pulls()).toBe(pulls + 1);
    expect(await s.db.outbox.count()).toBe(0);
    s.driver.stop();
  });

  it("offline stops the timer; nothing runs until the connection is back", async () => {
    const s = await setup();
    s.driver.start();
    await advance(s.driver, 0);
    s.win.dispatchEvent(new Event("offline"));
    const pulls = s.pulls();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    await advance(s.driver, 120_000);
    expect(s.pulls()).toBe(pulls);
    expect(s.driver.getStatus()).toMatchObject({ online: false, nextRunAt: null });
    s.win.dispatchEvent(new Event("online"));
    await advance(s.driver, 0);
    expect(s.pulls()).toBe(pulls + 1);
    s.driver.stop();
  });

  it("401: stops and says 'Sign in again'; becoming visible tries again", async () => {
    const s = await setup();
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    s.server.failNext = [401];
    s.driver.start();
    await advance(s.driver, 0);
    expect(s.driver.getStatus()).toMatchObject({ needsSignIn: true, lastError: "Sign in again to sync. Your changes stay on this device." });
    await advance(s.driver, 10 * 60_000);
    expect(s.pushes()).toBe(1);
    expect(await s.db.outbox.count()).toBe(1);
    s.doc.show("hidden");
    s.doc.show("visible");
    await advance(s.driver, 0);
    expect(s.pushes()).toBe(2);
    expect(s.driver.getStatus().needsSignIn).toBe(false);
    expect(await s.db.outbox.count()).toBe(0);
    s.driver.stop();
  });

  it("does not sync when another person is the device's current user", async () => {
    const s = await setup();
    const other = new SyncDriver({
      db: s.db,
      fetch: s.server.fetch,
      isCurrentUser: async () => false,
      env: { navigator: { onLine: true }, now: () => Date.now(), random: () => 1, setTimeout: (f, ms) => setTimeout(f, ms), clearTimeout: (h) => clearTimeout(h as ReturnType<typeof setTimeout>) },
    });
    await createLocal(s.db, "placements", PROJECT_ID, placementValues());
    other.start();
    await advance(other, 0);
    expect(s.server.pushes).toHaveLength(0);
    expect(other.getStatus().lastError).toMatch(/Someone else is signed in/);
    other.stop();
  });

  it("one tab leads (Web Locks); another tab's writes are sent by the leader; the next tab takes over when it closes", async () => {
    const locks = new FakeLocks();
    const bus = channelBus();
    const first = await setup({ locks, channel: bus });
    const second = await setup({ locks, channel: bus, db: first.db, server: first.server });
    first.driver.start();
    second.driver.start();
    await advance(first.driver, 0);
    expect(first.driver.getStatus().leader).toBe(true);
    expect(second.driver.getStatus().leader).toBe(false);
    expect(second.pulls()).toBe(0);

    // A write in the second tab: its driver asks the leader over the channel.
    await createLocal(second.db, "placements", PROJECT_ID, placementValues());
    await advance(first.driver, 1_000);
    expect(first.pushes()).toBe(1);
    expect(second.pushes()).toBe(0);
    expect(await first.db.outbox.count()).toBe(0);

    first.driver.stop();
    await advance(second.driver, 0);
    expect(second.driver.getStatus().leader).toBe(true);
    expect(second.pulls()).toBe(1);
    second.driver.stop();
  });

  it("without Web Locks every tab runs the loop", async () => {
    const s = await setup({ locks: undefined });
    s.driver.start();
    expect(s.driver.getStatus().leader).toBe(true);
    await advance(s.driver, 0);
    expect(s.pulls()).toBe(1);
    s.driver.stop();
  });

  it("asks once for persistent storage and warns when space is low", async () => {
    const persist = vi.fn(async () => true);
    const storage = { persist, persisted: async () => false, estimate: async () => ({ usage: 980 * 1024 * 1024, quota: 1_000 * 1024 * 1024 }) };
    const s = await setup({ storage });
    s.driver.start();
    await advance(s.driver, 0);
    expect(persist).toHaveBeenCalledTimes(1);
    expect(s.driver.getStatus()).toMatchObject({ persisted: true, storageWarning: expect.stringMatching(/low on space/) });
    s.driver.stop();
    s.driver.start();
    await advance(s.driver, 0);
    expect(persist).toHaveBeenCalledTimes(1);
    s.driver.stop();
  });
});
