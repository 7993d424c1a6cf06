// Server-side reads for the mix design screens, through the records' own read path.
import type { mixDesigns } from "@/db/schema";
import { allows, type ProjectAccess } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { getProjectForMember } from "@/lib/projects/queries";
import { getRecord, listRecords } from "@/lib/records/read";
import type { MixDesignValues } from "@/lib/records/schemas/mix-design";

export type MixDesignRow = typeof mixDesigns.$inferSelect;

/** The project and the user's role on it, or null when the user is not a member (or it does not exist). */
export async function projectForScreen(access: ProjectAccess) {
  try {
    const { project, role } = await getProjectForMember(access);
    return { project, role, access, canWriteMixes: allows(access, "mix.write") };
  } catch (error) {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "forbidden")) return null;
    throw error;
  }
}

export async function listMixes(access: ProjectAccess): Promise<MixDesignRow[]> {
  const { items } = await listRecords({ user: access.user, access }, "mix-designs", access.project.id, { limit: "200" });
  return (items as MixDesignRow[]).sort((a, b) => a.code.localeCompare(b.code));
}

export async function getMix(access: ProjectAccess, id: string): Promise<MixDesignRow | null> {
  try {
    return (await getRecord({ user: access.user, access }, "mix-designs", access.project.id, id)) as MixDesignRow;
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") return null;
    throw error;
  }
}

/** The fields the form edits (no dates or bookkeeping), for a client component. */
export function mixFormInput(row: MixDesignRow): MixDesignValues & { version: number } {
  return {
    id: row.id,
    version: row.version,
    code: row.code,
    supplier: row.supplier,
    fcMPa: row.fcMPa,
    fcAgeDays: row.fcAgeDays === 56 ? 56 : 28,
    maxWcm: row.maxWcm,
    slumpTargetMm: row.slumpTargetMm,
    slumpType: row.slumpType,
    slumpToleranceMm: row.slumpToleranceMm,
    airTargetPct: row.airTargetPct,
    airTolerancePct: row.airTolerancePct,
    maxConcreteTempC: row.maxConcreteTempC,
    cementType: row.cementType,
    scms: row.scms,
    siteWaterAllowedLPerM3: row.siteWaterAllowedLPerM3,
    lowBleed: row.lowBleed,
  };
}
