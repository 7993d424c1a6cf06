// When the sync driver runs: on start, after writes, on a timer, with back-off, offline.
import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { getMeta } from "@/lib/sync/client/db";
import { createLocal } from "@/lib/sync/client/mutate";
import { placementValues, PROJECT_ID } from "./helpers";
import { fakeDriverTimers, setup, advance } from "./driver-harness";

fakeDriverTimers();

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

});
