// The sync driver's test harness: fake timers, a document, Web Locks and a BroadcastChannel bus
// between tabs, and a driver wired to the fake server.
import "fake-indexeddb/auto";
import { afterEach, beforeEach, vi } from "vitest";
import { type SyncDb } from "@/lib/sync/client/db";
import { SyncDriver, type SyncEnv } from "@/lib/sync/client/driver";
import { FakeServer } from "./fake-server";
import { cleanupDbs, freshDb, project } from "./helpers";

/** Fakes only the timers the driver uses, for each test of the calling file. */
export function fakeDriverTimers() {
  // Only the timers the driver uses are faked: fake-indexeddb schedules its work with setImmediate.
  beforeEach(() => {
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout", "setInterval", "clearInterval", "Date"], now: new Date("2026-11-09T12:00:00Z") });
  });
  afterEach(async () => {
    vi.useRealTimers();
    await cleanupDbs();
  });
}

class FakeDocument extends EventTarget {
  visibilityState = "visible";
  show(state: "visible" | "hidden") {
    this.visibilityState = state;
    this.dispatchEvent(new Event("visibilitychange"));
  }
}

/** A lock manager with the Web Locks semantics the driver needs (exclusive, queued, abortable). */
export class FakeLocks {
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
export function channelBus() {
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

export type Setup = {
  db: SyncDb;
  server: FakeServer;
  win: EventTarget;
  doc: FakeDocument;
  navigator: NonNullable<SyncEnv["navigator"]> & { onLine: boolean };
  driver: SyncDriver;
  pushes: () => number;
  pulls: () => number;
};

export async function setup(options: { locks?: FakeLocks; channel?: ReturnType<typeof channelBus>; db?: SyncDb; server?: FakeServer; storage?: SyncEnv["navigator"] extends infer N ? N extends { storage?: infer S } ? S : never : never } = {}): Promise<Setup> {
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
export async function advance(driver: SyncDriver, ms: number) {
  await vi.advanceTimersByTimeAsync(ms);
  await driver.whenIdle();
  await vi.advanceTimersByTimeAsync(0);
  await driver.whenIdle();
}
