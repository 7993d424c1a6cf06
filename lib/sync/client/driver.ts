// The sync loop of one user on this device: push, then pull until nothing more. ONE tab leads, chosen
// with Web Locks ("placewright-sync-<userId>"): it holds the lock for its lifetime, the others queue
// for it and take over when the leader closes. Other tabs forward their "I wrote something" over a
// BroadcastChannel, and the leader broadcasts whether it is syncing. Without Web Locks every tab runs
// the loop (the outbox transactions keep that safe; the server ignores a repeated mutation id).
//
// When it runs is decided by the pure functions in timing.ts; here are only the timers and events.
// It also asks once for persistent storage and checks the free space after each cycle.
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { ensureMeta, getDeviceDb, getMeta, setMeta, type SyncDb } from "./db";
import { readCurrentIdentity } from "./identity";
import { pullAll } from "./pull";
import { pushAll, type FetchLike, type PushOutcome } from "./push";
import {
  decideAfterCycle,
  decideTrigger,
  DEFAULT_TIMING,
  initialSchedulerState,
  startCycle,
  storageWarning,
  type CycleResult,
  type Decision,
  type SchedulerState,
  type SyncTiming,
  type Trigger,
} from "./timing";

type Listener = () => void;

type LockManagerLike = {
  request(name: string, options: { signal?: AbortSignal }, callback: (lock: unknown) => Promise<unknown>): Promise<unknown>;
};

type StorageLike = {
  persist?: () => Promise<boolean>;
  persisted?: () => Promise<boolean>;
  estimate?: () => Promise<{ usage?: number; quota?: number }>;
};

type EventTargetLike = {
  addEventListener(type: string, listener: () => void): void;
  removeEventListener(type: string, listener: () => void): void;
};

type ChannelLike = {
  postMessage(message: unknown): void;
  close(): void;
  onmessage: ((event: { data: unknown }) => void) | null;
};

/** Everything the driver takes from the browser (injected in tests). */
export type SyncEnv = {
  window?: EventTargetLike;
  document?: EventTargetLike & { visibilityState: string };
  navigator?: { onLine?: boolean; locks?: LockManagerLike; storage?: StorageLike };
  createChannel?: (name: string) => ChannelLike;
  now: () => number;
  random: () => number;
  setTimeout: (fn: () => void, ms: number) => unknown;
  clearTimeout: (handle: unknown) => void;
};

export type DriverStatus = {
  /** This tab runs the loop. */
  leader: boolean;
  /** A cycle is running (in the leading tab, as it broadcasts). */
  syncing: boolean;
  online: boolean;
  /** The last cycle's problem in words (null after a success). */
  lastError: string | null;
  /** The server said 401: the person must sign in again for sync to resume. */
  needsSignIn: boolean;
  /** When the next run is due (ms since epoch), if one is scheduled. */
  nextRunAt: number | null;
  storageWarning: string | null;
  /** Whether the browser granted persistent storage (null: unknown). */
  persisted: boolean | null;
};

export type DriverOptions = {
  db: SyncDb;
  fetch?: FetchLike;
  env?: Partial<SyncEnv>;
  timing?: Partial<SyncTiming>;
  /**
   * Whether this database's user is still the device's current user; checked before each cycle so a
   * tab left open after another person signed in never sends the first person's changes under the
   * second person's session. Default: the device database's current user.
   */
  isCurrentUser?: () => Promise<boolean>;
};

export type CycleOutcome = { result: CycleResult; message: string | null };

const STALE_SENDING_MS = 2 * 60_000;

function browserEnv(): SyncEnv {
  const g = globalThis as typeof globalThis & { window?: Window; document?: Document; navigator?: Navigator };
  return {
    window: typeof window !== "undefined" ? g.window : undefined,
    document: typeof document !== "undefined" ? g.document : undefined,
    navigator: typeof navigator !== "undefined" ? (g.navigator as unknown as SyncEnv["navigator"]) : undefined,
    createChannel: typeof BroadcastChannel !== "undefined" ? (name) => new BroadcastChannel(name) as unknown as ChannelLike : undefined,
    now: () => Date.now(),
    random: () => Math.random(),
    setTimeout: (fn, ms) => globalThis.setTimeout(fn, ms),
    clearTimeout: (handle) => globalThis.clearTimeout(handle as ReturnType<typeof setTimeout>),
  };
}

export const lockName = (userId: string) => `placewright-sync-${userId}`;

type ChannelMessage = { type: "request" } | { type: "status"; syncing: boolean; lastError: string | null; needsSignIn: boolean };

export class SyncDriver {
  readonly db: SyncDb;
  private readonly env: SyncEnv;
  private readonly timing: SyncTiming;
  private readonly fetchFn: FetchLike;
  private readonly isCurrentUser: () => Promise<boolean>;
  private scheduler: SchedulerState;
  private status: DriverStatus;
  private listeners = new Set<Listener>();
  private timer: unknown = null;
  private dueAt: number | null = null;
  private started = false;
  private cleanup: (() => void)[] = [];
  private releaseLock: (() => void) | null = null;
  private channel: ChannelLike | null = null;
  private cycle: Promise<CycleOutcome> | null = null;

  constructor(options: DriverOptions) {
    this.db = options.db;
    this.env = { ...browserEnv(), ...options.env };
    this.timing = { ...DEFAULT_TIMING, ...options.timing };
    this.fetchFn = options.fetch ?? ((input, init) => globalThis.fetch(input, init));
    this.isCurrentUser =
      options.isCurrentUser ??
      (async () => {
        const current = await readCurrentIdentity(getDeviceDb());
        return current?.id === this.db.userId;
      });
    const online = this.env.navigator?.onLine ?? true;
    this.scheduler = initialSchedulerState(online);
    this.status = {
      leader: false,
      syncing: false,
      online,
      lastError: null,
      needsSignIn: false,
      nextRunAt: null,
      storageWarning: null,
      persisted: null,
    };
  }

  // -------------------------------------------------------------------------------------------
  // status for React (useSyncExternalStore)

  getStatus = (): DriverStatus => this.status;

  subscribe = (listener: Listener): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  private setStatus(patch: Partial<DriverStatus>) {
    const next = { ...this.status, ...patch };
    if ((Object.keys(patch) as (keyof DriverStatus)[]).every((key) => next[key] === this.status[key])) return;
    this.status = next;
    for (const listener of [...this.listeners]) listener();
  }

  // -------------------------------------------------------------------------------------------
  // life cycle

  /** Starts listening, and competes for leadership. Safe to call again after stop(). */
  start(): void {
    if (this.started) return;
    this.started = true;
    const { window: win, document: doc } = this.env;

    const on = (target: EventTargetLike | undefined, type: string, fn: () => void) => {
      if (!target) return;
      target.addEventListener(type, fn);
      this.cleanup.push(() => target.removeEventListener(type, fn));
    };
    on(win, "online", () => {
      this.setStatus({ online: true });
      this.trigger("online");
    });
    on(win, "offline", () => {
      this.setStatus({ online: false });
      this.trigger("offline");
    });
    on(doc, "visibilitychange", () => this.trigger(doc?.visibilityState === "visible" ? "visible" : "hidden"));
    this.cleanup.push(this.db.onLocalWrite(() => this.requestSync()));

    if (this.env.createChannel) {
      const channel = this.env.createChannel(lockName(this.db.userId));
      channel.onmessage = (event) => this.onChannelMessage(event.data as ChannelMessage);
      this.channel = channel;
      this.cleanup.push(() => {
        channel.onmessage = null;
        channel.close();
      });
    }

    const locks = this.env.navigator?.locks;
    if (locks) {
      const abort = new AbortController();
      this.cleanup.push(() => abort.abort());
      locks
        .request(lockName(this.db.userId), { signal: abort.signal }, () => {
          if (!this.started) return Promise.resolve();
          this.becomeLeader();
          return new Promise<void>((resolve) => {
            this.releaseLock = resolve;
          });
        })
        .catch(() => {
          // Aborted while waiting for the lock (this tab stopped first): nothing to do.
        });
    } else {
      this.becomeLeader();
    }
  }

  /** Stops timers and listeners and gives up leadership; waiting changes stay in the outbox. */
  stop(): void {
    if (!this.started) return;
    this.started = false;
    for (const fn of this.cleanup.splice(0)) fn();
    this.cancelTimer();
    this.channel = null;
    this.releaseLock?.();
    this.releaseLock = null;
    this.setStatus({ leader: false, syncing: false, nextRunAt: null });
  }

  private becomeLeader() {
    this.setStatus({ leader: true });
    void this.prepareStorage();
    this.trigger("start");
  }

  private onChannelMessage(message: ChannelMessage) {
    if (!message || typeof message !== "object") return;
    if (message.type === "request" && this.status.leader) this.trigger("local-write");
    if (message.type === "status" && !this.status.leader) {
      this.setStatus({ syncing: message.syncing, lastError: message.lastError, needsSignIn: message.needsSignIn });
    }
  }

  private broadcastStatus() {
    this.channel?.postMessage({
      type: "status",
      syncing: this.status.syncing,
      lastError: this.status.lastError,
      needsSignIn: this.status.needsSignIn,
    } satisfies ChannelMessage);
  }

  // -------------------------------------------------------------------------------------------
  // triggers and the timer

  /** Asks for a sync soon (after local writes; debounced). In a follower tab, asks the leader. */
  requestSync(): void {
    if (!this.started) return;
    if (this.status.leader) this.trigger("local-write");
    else this.channel?.postMessage({ type: "request" } satisfies ChannelMessage);
  }

  /** Runs a cycle now if this tab leads ("Sync now"); otherwise asks the leader. */
  syncNow(): void {
    if (!this.started) return;
    if (this.status.leader) this.trigger("manual");
    else this.channel?.postMessage({ type: "request" } satisfies ChannelMessage);
  }

  /** Feeds a trigger to the scheduler (exposed for tests and the service worker bridge). */
  trigger(trigger: Trigger): void {
    if (!this.started || !this.status.leader) return;
    this.apply(decideTrigger(this.scheduler, trigger, this.env.now(), this.timing));
  }

  private apply(decision: Decision) {
    this.scheduler = decision.state;
    if (decision.cancel) this.cancelTimer();
    if (decision.runAt !== null && this.started) {
      if (decision.replace || this.dueAt === null || decision.runAt < this.dueAt) this.setTimer(decision.runAt);
    }
  }

  private setTimer(at: number) {
    this.cancelTimer();
    this.dueAt = at;
    this.timer = this.env.setTimeout(() => {
      this.timer = null;
      this.dueAt = null;
      this.setStatus({ nextRunAt: null });
      void this.runCycle();
    }, Math.max(0, at - this.env.now()));
    this.setStatus({ nextRunAt: at });
  }

  private cancelTimer() {
    if (this.timer !== null) this.env.clearTimeout(this.timer);
    this.timer = null;
    this.dueAt = null;
    this.setStatus({ nextRunAt: null });
  }

  // -------------------------------------------------------------------------------------------
  // one cycle

  /** Runs one push-then-pull cycle now (the timer calls this; tests may too). */
  runCycle(): Promise<CycleOutcome> {
    if (this.cycle) {
      this.scheduler = { ...this.scheduler, rerun: true };
      return this.cycle;
    }
    this.scheduler = startCycle(this.scheduler);
    this.setStatus({ syncing: true });
    this.broadcastStatus();
    const run = async (): Promise<CycleOutcome> => {
      let outcome: CycleOutcome;
      try {
        outcome = await this.cycleBody();
      } catch (error) {
        console.error("sync: cycle failed", error);
        outcome = { result: "failed", message: "Sync stopped because of an error on this device. It will try again." };
      }
      await this.recordOutcome(outcome);
      return outcome;
    };
    this.cycle = run().then((outcome) => {
      this.cycle = null;
      this.apply(decideAfterCycle(this.scheduler, outcome.result, this.env.now(), this.env.random, this.timing));
      return outcome;
    });
    return this.cycle;
  }

  /** Resolves when no cycle is running (tests; a sign-out that wants to wait for a last push). */
  async whenIdle(): Promise<void> {
    while (this.cycle) await this.cycle;
  }

  private async cycleBody(): Promise<CycleOutcome> {
    if (!(await this.isCurrentUser())) {
      return { result: "unauthenticated", message: "Someone else is signed in on this device. These changes wait for their owner to sign in." };
    }
    await ensureMeta(this.db, SYNC_SCHEMA_VERSION);
    const push = await pushAll(this.db, {
      fetch: this.fetchFn,
      recoverSendingAfterMs: this.env.navigator?.locks ? 0 : STALE_SENDING_MS,
    });
    if (push.kind === "unauthenticated" || push.kind === "transient") return fromPush(push);
    const pull = await pullAll(this.db, { fetch: this.fetchFn });
    if (push.kind === "gap" || push.kind === "failed") return fromPush(push);
    if (pull.kind !== "ok") return { result: pull.kind, message: pull.message };
    // Changes written while this cycle ran are sent by the rerun that the scheduler queues.
    return { result: "ok", message: null };
  }

  private async recordOutcome(outcome: CycleOutcome) {
    const needsSignIn = outcome.result === "unauthenticated";
    try {
      if (outcome.result === "ok") {
        await setMeta(this.db, "lastSyncAt", new Date(this.env.now()).toISOString());
        await setMeta(this.db, "lastError", null);
      } else {
        await setMeta(this.db, "lastError", outcome.message);
      }
    } catch (error) {
      console.error("sync: could not record the sync state", error);
    }
    this.setStatus({ syncing: false, lastError: outcome.message, needsSignIn });
    this.broadcastStatus();
    void this.checkStorage();
  }

  // -------------------------------------------------------------------------------------------
  // storage

  private async prepareStorage() {
    const storage = this.env.navigator?.storage;
    if (!storage) return;
    try {
      let persisted = storage.persisted ? await storage.persisted() : null;
      if (!persisted && storage.persist && !(await getMeta(this.db, "persistRequested"))) {
        await setMeta(this.db, "persistRequested", true);
        persisted = await storage.persist();
      }
      this.setStatus({ persisted });
    } catch (error) {
      console.warn("sync: persistent storage request failed", error);
    }
    await this.checkStorage();
  }

  private async checkStorage() {
    const estimate = this.env.navigator?.storage?.estimate;
    if (!estimate) return;
    try {
      this.setStatus({ storageWarning: storageWarning(await estimate.call(this.env.navigator?.storage)) });
    } catch {
      // Some browsers refuse estimate() in private windows; no warning then.
    }
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
