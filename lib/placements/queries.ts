import type { placements } from "@/db/schema";
import type { ProjectAccess } from "@/lib/auth/access";
import { listMixes } from "@/lib/mixes/queries";
import { listRecords } from "@/lib/records/read";

type PlacementRow = typeof placements.$inferSelect;

export type PlacementListItem = Pick<
  PlacementRow,
  "id" | "element" | "level" | "grid" | "plannedStart" | "plannedVolumeM3" | "state" | "holdReason"
> & { mixCode: string | null };

/** The project's placements in planned order with their mix codes, for the project page. */
export async function listPlacementsForScreen(access: ProjectAccess): Promise<PlacementListItem[]> {
  const [{ items }, mixes] = await Promise.all([
    listRecords({ user: access.user, access }, "placements", access.project.id, { limit: "200" }),
    listMixes(access),
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
