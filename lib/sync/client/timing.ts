// When the sync loop runs: pure decisions (no timers, no DOM) so they can be tested with fake time.
// The driver keeps a SchedulerState, feeds it triggers and cycle results, and sets ONE timer at the
// returned time.
//
// - start, online, manual: now (online and manual also forget the back-off: the network is back, or
//   the person asked);
// - visibility → visible: now, unless backing off (then at the end of the back-off); it also retries
//   after "sign in again", since the person may have signed in in another tab;
// - local write: after a short debounce (~1 s), never before the back-off ends;
// - interval: ~30 s after a successful cycle;
// - failure: exponential back-off with jitter, 2 s doubling to 5 min; reset on success;
// - offline: nothing runs until `online`; after "sign in again" only visible/online/manual/start run.

export type SyncTiming = {
  debounceMs: number;
  intervalMs: number;
  backoffBaseMs: number;
  backoffMaxMs: number;
};

export const DEFAULT_TIMING: SyncTiming = {
  debounceMs: 1_000,
  intervalMs: 30_000,
  backoffBaseMs: 2_000,
  backoffMaxMs: 5 * 60_000,
};

export type Trigger = "start" | "online" | "offline" | "visible" | "hidden" | "local-write" | "interval" | "manual";

/** How a sync cycle ended. */
export type CycleResult = "ok" | "transient" | "failed" | "gap" | "unauthenticated" | "skipped";

export type SchedulerState = {
  online: boolean;
  /** Consecutive failed cycles. */
  failures: number;
  /** No run before this time (ms) unless online/manual/start. 0: not backing off. */
  backoffUntil: number;
  /** "auth": the server said 401; wait for a sign-in. */
  paused: "auth" | null;
  running: boolean;
  /** A trigger arrived while a cycle ran: run again when it ends. */
  rerun: boolean;
};

export type Decision = {
  state: SchedulerState;
  /** When to run (ms since epoch), or null for no run. */
  runAt: number | null;
  /** True: replace the current timer; false: keep it if it is earlier. */
  replace: boolean;
  /** True: cancel the current timer (offline, signed out). */
  cancel?: boolean;
};

export function initialSchedulerState(online: boolean): SchedulerState {
  return { online, failures: 0, backoffUntil: 0, paused: null, running: false, rerun: false };
}

/**
 * The back-off before retry number `failures` (1 → ~2 s, 2 → ~4 s … capped at 5 min), with jitter:
 * between half and all of the exponential delay, so many devices coming back at once spread out.
 */
export function backoffDelay(failures: number, random: () => number = Math.random, timing: SyncTiming = DEFAULT_TIMING): number {
  if (failures <= 0) return 0;
  const exponent = Math.min(failures - 1, 30);
  const cap = Math.min(timing.backoffMaxMs, timing.backoffBaseMs * 2 ** exponent);
  const r = Math.min(Math.max(random(), 0), 1);
  return Math.round(cap / 2 + (cap / 2) * r);
}

/** What to do when something happens. */
export function decideTrigger(state: SchedulerState, trigger: Trigger, now: number, timing: SyncTiming = DEFAULT_TIMING): Decision {
  const none = (next: SchedulerState = state): Decision => ({ state: next, runAt: null, replace: false });
  switch (trigger) {
    case "offline":
      return { state: { ...state, online: false }, runAt: null, replace: true, cancel: true };
    case "hidden":
      return none();
    case "online": {
      const next = { ...state, online: true, failures: 0, backoffUntil: 0, paused: null };
      return queueIfRunning(next, now, true);
    }
    case "start": {
      if (!state.online) return none({ ...state, paused: null });
      return queueIfRunning({ ...state, paused: null }, now, true);
    }
    case "manual": {
      return queueIfRunning({ ...state, failures: 0, backoffUntil: 0, paused: null }, now, true);
    }
    case "visible": {
      if (!state.online) return none();
      const next = { ...state, paused: null };
      return queueIfRunning(next, Math.max(now, state.backoffUntil), false);
    }
    case "local-write": {
      if (!state.online || state.paused) return none();
      return queueIfRunning(state, Math.max(now + timing.debounceMs, state.backoffUntil), false);
    }
    case "interval": {
      if (!state.online || state.paused) return none();
      return queueIfRunning(state, Math.max(now, state.backoffUntil), false);
    }
  }
}

function queueIfRunning(state: SchedulerState, runAt: number, replace: boolean): Decision {
  if (state.running) return { state: { ...state, rerun: true }, runAt: null, replace: false };
  return { state, runAt, replace };
}

/** A cycle starts. */
export function startCycle(state: SchedulerState): SchedulerState {
  return { ...state, running: true, rerun: false };
}

/** What to do after a cycle. */
export function decideAfterCycle(
  state: SchedulerState,
  result: CycleResult,
  now: number,
  random: () => number = Math.random,
  timing: SyncTiming = DEFAULT_TIMING,
): Decision {
  const base = { ...state, running: false, rerun: false };
  switch (result) {
    case "ok": {
      const next = { ...base, failures: 0, backoffUntil: 0, paused: null };
      // Changes made while the cycle ran go out after the debounce; otherwise the interval.
      return { state: next, runAt: now + (state.rerun ? timing.debounceMs : timing.intervalMs), replace: true };
    }
    case "skipped":
      return { state: base, runAt: state.rerun ? now + timing.debounceMs : now + timing.intervalMs, replace: true };
    case "unauthenticated":
      return { state: { ...base, paused: "auth" }, runAt: null, replace: true, cancel: true };
    case "transient":
    case "failed":
    case "gap": {
      const failures = state.failures + 1;
      const backoffUntil = now + backoffDelay(failures, random, timing);
      const next = { ...base, failures, backoffUntil };
      if (!next.online) return { state: next, runAt: null, replace: true, cancel: true };
      return { state: next, runAt: backoffUntil, replace: true };
    }
  }
}

// ---------------------------------------------------------------------------------------------
// storage

export const LOW_SPACE_BYTES = 50 * 1024 * 1024;
export const HIGH_USAGE_RATIO = 0.9;

/** A warning in words when the device is short of space (< 50 MB free or > 90 % used), else null. */
export function storageWarning(estimate: { usage?: number; quota?: number } | null | undefined): string | null {
  if (!estimate || !estimate.quota) return null;
  const usage = estimate.usage ?? 0;
  const free = Math.max(estimate.quota - usage, 0);
  if (free < LOW_SPACE_BYTES || usage / estimate.quota > HIGH_USAGE_RATIO) {
    const mb = Math.floor(free / (1024 * 1024));
    return `This device is low on space (${mb} MB left for Placewright). Sync soon and free some space so new records and photos can be saved.`;
  }
  return null;
}
