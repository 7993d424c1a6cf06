// The sync driver asks for persistent storage and warns when space is low.
import "fake-indexeddb/auto";
import { describe, expect, it, vi } from "vitest";
import { fakeDriverTimers, setup, advance } from "./driver-harness";

fakeDriverTimers();

describe("sync driver", () => {
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
