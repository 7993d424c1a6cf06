// Bundled by scripts/bench-device.mts (esbuild) into a page: the field screens' own write path.
import { getUserDb } from "@/lib/sync/client/db";
import { createLocal, updateLocal } from "@/lib/sync/client/mutate";

declare global {
  interface Window {
    benchSaves: (count: number) => Promise<number[]>;
  }
}

const at = (minutes: number) => new Date(Date.parse("2026-11-16T14:00:00Z") + minutes * 60_000).toISOString();

/** `count` local saves (record + outbox entry in one IndexedDB transaction), each timed in ms. */
window.benchSaves = async (count: number) => {
  const db = getUserDb(crypto.randomUUID());
  const projectId = crypto.randomUUID();
  const placement = await createLocal(db, "placements", projectId, {
    element: "Bench slab",
    level: "L2",
    grid: "A-D/1-4",
    elementType: "elevated-slab",
    plannedStart: at(0),
  });
  const times: number[] = [];
  for (let i = 0; i < count; i++) {
    const start = performance.now();
    if (i % 5 === 4) {
      // Every fifth save edits the placement, as a person correcting a field does.
      await updateLocal(db, "placements", placement.id, { grid: `A-D/${i}` });
    } else {
      await createLocal(db, "deliveries", projectId, {
        placementId: placement.id,
        ticketNumber: `B-${i}`,
        truck: `T-${i % 40}`,
        volumeM3: 8,
        batchedAt: at(i),
        arrivedAt: at(i + 30),
      });
    }
    times.push(performance.now() - start);
  }
  return times;
};
