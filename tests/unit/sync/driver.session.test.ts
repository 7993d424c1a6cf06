// The sync driver stops for a lost session and for another person on the device.
import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { SyncDriver } from "@/lib/sync/client/driver";
import { createLocal } from "@/lib/sync/client/mutate";
import { placementValues, PROJECT_ID } from "./helpers";
import { fakeDriverTimers, setup, advance } from "./driver-harness";

fakeDriverTimers();

describe("sync driver", () => {
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

});
