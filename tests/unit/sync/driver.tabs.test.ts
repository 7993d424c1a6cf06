// The sync driver across browser tabs: one leader under Web Locks, every tab without them.
import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { createLocal } from "@/lib/sync/client/mutate";
import { placementValues, PROJECT_ID } from "./helpers";
import { fakeDriverTimers, FakeLocks, channelBus, setup, advance } from "./driver-harness";

fakeDriverTimers();

describe("sync driver", () => {
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

});
