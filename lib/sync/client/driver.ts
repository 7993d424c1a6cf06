// The sync loop of one user on this device: push, then pull until nothing more. ONE tab leads, chosen
// with Web Locks ("placewright-sync-<userId>"): it holds the lock for its lifetime, the others queue
// for it and take over when the leader closes. Other tabs forward their "I wrote something" over a
// BroadcastChannel, and the leader broadcasts whether it is syncing. Without Web Locks every tab runs
// the loop (the outbox transactions keep that safe; the server ignores a repeated mutation id).
//
// When it runs is decided by the pure functions in timing.ts; here are only the timers and events.
// It also asks once for persistent storage and checks the free space after each cycle.
import { checkFreeSpace, recordCycle, requestPersistence, runOnce, type CycleOutcome } from "./cycle";
import type { SyncDb } from "./db";
import { browserEnv, holdLock, initialStatus, listen, StatusStore, type ChannelLike, type DriverOptions, type DriverStatus, type SyncEnv } from "./driver-env";
import { isCurrentIdentity } from "./identity";
import type { FetchLike } from "./push";
import {
  decideAfterCycle,
  decideTrigger,
  DEFAULT_TIMING,
  initialSchedulerState,
  startCycle,
  type Decision,
  type SchedulerState,
  type SyncTiming,
  type Trigger,
} from "./timing";

export type { CycleOutcome, DriverOptions, DriverStatus, SyncEnv };

const STALE_SENDING_MS = 2 * 60_000;

export const lockName = (userId: string) => `placewright-sync-${userId}`;

type ChannelMessage = { type: "request" } | { type: "status"; syncing: boolean; lastError: string | null; needsSignIn: boolean };

export class SyncDriver {
  readonly db: SyncDb;
  private readonly env: SyncEnv;
  private readonly timing: SyncTiming;
  private readonly fetchFn: FetchLike;
  private readonly isCurrentUser: () => Promise<boolean>;
  private scheduler: SchedulerState;
  private readonly store: StatusStore;
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
    this.isCurrentUser = options.isCurrentUser ?? (() => isCurrentIdentity(this.db.userId));
    const online = this.env.navigator?.onLine ?? true;
    this.scheduler = initialSchedulerState(online);
    this.store = new StatusStore(initialStatus(online));
  }

  // status for React (useSyncExternalStore)

  getStatus = (): DriverStatus => this.store.get();

  subscribe = (listener: () => void): (() => void) => this.store.subscribe(listener);

  // life cycle

  /** Starts listening, and competes for leadership. Safe to call again after stop(). */
  start(): void {
    if (this.started) return;
    this.started = true;
    const { window: win, document: doc } = this.env;
    this.cleanup.push(
      listen(win, "online", () => {
        this.store.set({ online: true });
        this.trigger("online");
      }),
      listen(win, "offline", () => {
        this.store.set({ online: false });
        this.trigger("offline");
      }),
      listen(doc, "visibilitychange", () => this.trigger(doc?.visibilityState === "visible" ? "visible" : "hidden")),
      this.db.onLocalWrite(() => this.requestSync()),
    );

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
    if (!locks) return this.becomeLeader();
    const lead = holdLock(locks, lockName(this.db.userId), () => {
      if (!this.started) return false;
      this.becomeLeader();
      return true;
    });
    this.cleanup.push(lead.abort);
    this.releaseLock = lead.release;
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
    this.store.set({ leader: false, syncing: false, nextRunAt: null });
  }

  private becomeLeader() {
    this.store.set({ leader: true });
    void this.prepareStorage();
    this.trigger("start");
  }

  private onChannelMessage(message: ChannelMessage) {
    if (!message || typeof message !== "object") return;
    if (message.type === "request" && this.store.get().leader) this.trigger("local-write");
    if (message.type === "status" && !this.store.get().leader) {
      this.store.set({ syncing: message.syncing, lastError: message.lastError, needsSignIn: message.needsSignIn });
    }
  }

  private broadcastStatus() {
    this.channel?.postMessage({
      type: "status",
      syncing: this.store.get().syncing,
      lastError: this.store.get().lastError,
      needsSignIn: this.store.get().needsSignIn,
    } satisfies ChannelMessage);
  }

  // triggers and the timer

  /** Asks for a sync soon (after local writes; debounced). In a follower tab, asks the leader. */
  requestSync(): void {
    if (!this.started) return;
    if (this.store.get().leader) this.trigger("local-write");
    else this.channel?.postMessage({ type: "request" } satisfies ChannelMessage);
  }

  /** Runs a cycle now if this tab leads ("Sync now"); otherwise asks the leader. */
  syncNow(): void {
    if (!this.started) return;
    if (this.store.get().leader) this.trigger("manual");
    else this.channel?.postMessage({ type: "request" } satisfies ChannelMessage);
  }

  /** Feeds a trigger to the scheduler (exposed for tests and the service worker bridge). */
  trigger(trigger: Trigger): void {
    if (!this.started || !this.store.get().leader) return;
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
      this.store.set({ nextRunAt: null });
      void this.runCycle();
    }, Math.max(0, at - this.env.now()));
    this.store.set({ nextRunAt: at });
  }

  private cancelTimer() {
    if (this.timer !== null) this.env.clearTimeout(this.timer);
    this.timer = null;
    this.dueAt = null;
    this.store.set({ nextRunAt: null });
  }

  // one cycle

  /** Runs one push-then-pull cycle now (the timer calls this; tests may too). */
  runCycle(): Promise<CycleOutcome> {
    if (this.cycle) {
      this.scheduler = { ...this.scheduler, rerun: true };
      return this.cycle;
    }
    this.scheduler = startCycle(this.scheduler);
    this.store.set({ syncing: true });
    this.broadcastStatus();
    const run = async (): Promise<CycleOutcome> => {
      let outcome: CycleOutcome;
      try {
        outcome = await runOnce(this.db, {
          fetch: this.fetchFn,
          isCurrentUser: this.isCurrentUser,
          recoverSendingAfterMs: this.env.navigator?.locks ? 0 : STALE_SENDING_MS,
        });
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

  private async recordOutcome(outcome: CycleOutcome) {
    const needsSignIn = outcome.result === "unauthenticated";
    await recordCycle(this.db, outcome, this.env.now());
    this.store.set({ syncing: false, lastError: outcome.message, needsSignIn });
    this.broadcastStatus();
    void this.checkStorage();
  }

  private async prepareStorage() {
    const persisted = await requestPersistence(this.db, this.env.navigator?.storage);
    if (persisted !== undefined) this.store.set({ persisted });
    await this.checkStorage();
  }

  private async checkStorage() {
    const warning = await checkFreeSpace(this.env.navigator?.storage);
    if (warning !== undefined) this.store.set({ storageWarning: warning });
  }
}
