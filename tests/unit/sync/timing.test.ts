import { describe, expect, it } from "vitest";
import {
  backoffDelay,
  decideAfterCycle,
  decideTrigger,
  DEFAULT_TIMING,
  initialSchedulerState,
  startCycle,
  storageWarning,
  type SchedulerState,
} from "@/lib/sync/client/timing";

const NOW = 1_000_000;
const MB = 1024 * 1024;

describe("back-off", () => {
  it("doubles from 2 s to a 5 min cap (no jitter at random = 1)", () => {
    const delays = Array.from({ length: 10 }, (_, i) => backoffDelay(i + 1, () => 1));
    expect(delays).toEqual([2_000, 4_000, 8_000, 16_000, 32_000, 64_000, 128_000, 256_000, 300_000, 300_000]);
  });

  it("jitters between half and all of the step", () => {
    expect(backoffDelay(1, () => 0)).toBe(1_000);
    expect(backoffDelay(3, () => 0.5)).toBe(6_000);
    for (let n = 1; n < 40; n += 1) {
      const d = backoffDelay(n, Math.random);
      const cap = Math.min(300_000, 2_000 * 2 ** (n - 1));
      expect(d).toBeGreaterThanOrEqual(cap / 2);
      expect(d).toBeLessThanOrEqual(cap);
    }
  });

  it("is zero before any failure", () => {
    expect(backoffDelay(0)).toBe(0);
  });

  it("after each failed cycle the next run is the back-off away; success resets it", () => {
    let state: SchedulerState = initialSchedulerState(true);
    const runs: number[] = [];
    let now = NOW;
    for (let i = 0; i < 4; i += 1) {
      state = startCycle(state);
      const d = decideAfterCycle(state, "transient", now, () => 1);
      state = d.state;
      runs.push(d.runAt! - now);
      now = d.runAt!;
    }
    expect(runs).toEqual([2_000, 4_000, 8_000, 16_000]);
    const ok = decideAfterCycle(startCycle(state), "ok", now, () => 1);
    expect(ok).toMatchObject({ runAt: now + DEFAULT_TIMING.intervalMs, replace: true });
    expect(ok.state).toMatchObject({ failures: 0, backoffUntil: 0 });
    const again = decideAfterCycle(startCycle(ok.state), "failed", now, () => 1);
    expect(again.runAt).toBe(now + 2_000);
  });
});

describe("trigger decisions", () => {
  const idle = initialSchedulerState(true);
  const backingOff: SchedulerState = { ...idle, failures: 3, backoffUntil: NOW + 8_000 };

  it("start runs now", () => {
    expect(decideTrigger(idle, "start", NOW)).toMatchObject({ runAt: NOW, replace: true });
  });

  it("a local write runs after the debounce, and never before the back-off ends", () => {
    expect(decideTrigger(idle, "local-write", NOW)).toMatchObject({ runAt: NOW + 1_000, replace: false });
    expect(decideTrigger(backingOff, "local-write", NOW).runAt).toBe(NOW + 8_000);
  });

  it("online runs now and forgets the back-off", () => {
    const d = decideTrigger({ ...backingOff, online: false }, "online", NOW);
    expect(d).toMatchObject({ runAt: NOW, replace: true });
    expect(d.state).toMatchObject({ online: true, failures: 0, backoffUntil: 0 });
  });

  it("visible runs now, or when the back-off ends", () => {
    expect(decideTrigger(idle, "visible", NOW).runAt).toBe(NOW);
    expect(decideTrigger(backingOff, "visible", NOW).runAt).toBe(NOW + 8_000);
    expect(decideTrigger(idle, "hidden", NOW).runAt).toBeNull();
  });

  it("offline cancels the timer and nothing but online or manual runs", () => {
    const off = decideTrigger(idle, "offline", NOW);
    expect(off).toMatchObject({ runAt: null, cancel: true });
    for (const t of ["local-write", "interval", "visible", "start"] as const) expect(decideTrigger(off.state, t, NOW).runAt).toBeNull();
    expect(decideTrigger(off.state, "manual", NOW).runAt).toBe(NOW);
    expect(decideTrigger(off.state, "online", NOW).runAt).toBe(NOW);
  });

  it("after 'sign in again' only visible, online, manual or start run", () => {
    const paused = decideAfterCycle(startCycle(idle), "unauthenticated", NOW).state;
    expect(paused.paused).toBe("auth");
    expect(decideTrigger(paused, "local-write", NOW).runAt).toBeNull();
    expect(decideTrigger(paused, "interval", NOW).runAt).toBeNull();
    expect(decideTrigger(paused, "visible", NOW)).toMatchObject({ runAt: NOW, state: { paused: null } });
  });

  it("a trigger during a cycle asks for another one right after it (debounced)", () => {
    const running = startCycle(idle);
    const d = decideTrigger(running, "local-write", NOW);
    expect(d).toMatchObject({ runAt: null, state: { rerun: true } });
    expect(decideAfterCycle(d.state, "ok", NOW).runAt).toBe(NOW + 1_000);
  });
});

describe("storage warning", () => {
  it("warns below 50 MB free or above 90 % used", () => {
    expect(storageWarning({ usage: 10 * MB, quota: 2_000 * MB })).toBeNull();
    expect(storageWarning({ usage: 1_950 * MB + 1, quota: 2_000 * MB })).toMatch(/low on space \(49 MB left/);
    expect(storageWarning({ usage: 91 * MB, quota: 100 * MB })).toMatch(/low on space/);
    expect(storageWarning(undefined)).toBeNull();
    expect(storageWarning({ usage: 0, quota: 0 })).toBeNull();
  });
});
