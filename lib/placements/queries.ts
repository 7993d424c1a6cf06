import type { placements } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { listMixes } from "@/lib/mixes/queries";
import { listRecords } from "@/lib/records/read";

type PlacementRow = typeof placements.$inferSelect;

export type PlacementListItem = Pick<
  PlacementRow,
  "id" | "element" | "level" | "grid" | "plannedStart" | "plannedVolumeM3" | "state" | "holdReason"
> & { mixCode: string | null };

/** The project's placements in planned order with their mix codes, for the project page. */
export async function listPlacementsForScreen(user: SessionUser, projectId: string): Promise<PlacementListItem[]> {
  const [{ items }, mixes] = await Promise.all([
    listRecords({ user }, "placements", projectId, { limit: "200" }),
    listMixes(user, projectId),
  ]);
  const codes = new Map(mixes.map((m) => [m.id, m.code]));
  return (items as PlacementRow[]).map((p) => ({
    id: p.id,
    element: p.element,
    level: p.level,
    grid: p.grid,
    plannedStart: p.plannedStart,
    plannedVolumeM3: p.plannedVolumeM3,
    state: p.state,
    holdReason: p.holdReason,
    mixCode: p.mixId ? (codes.get(p.mixId) ?? null) : null,
  }));
}
