// Server reads for the lab: a project's specimen sets with their breaks, strength tests and
// acceptance per mix. Every read is scoped to a project the user may read (lib/auth).
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { db } from "@/db";
import { breaks, mixDesigns, placements, specimenSets, temperatureSensors } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { allows, permit, type ProjectAccess } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { acceptanceQuerySchema, setsQuerySchema } from "./schemas";
import { mixAcceptance, strengthTests, type LabBreak, type LabSet, type MixAcceptance, type StrengthTestRow } from "@/lib/checks/strength";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;


type SetRow = LabSet & {
  deliveryId: string | null;
  cylinderLengthMm: number;
  initialCuringMinC: number | null;
  initialCuringMaxC: number | null;
  sensorId: string | null;
  version: number;
  placement: { id: string; element: string; level: string; mixId: string | null; state: string };
};

async function loadProjectLab(projectId: string, placementId?: string) {
  const conditions = [eq(specimenSets.projectId, projectId), isNull(specimenSets.deletedAt)];
  if (placementId) conditions.push(eq(specimenSets.placementId, placementId));
  const setRows = await db
    .select({
      set: specimenSets,
      placement: { id: placements.id, element: placements.element, level: placements.level, mixId: placements.mixId, state: placements.state },
    })
    .from(specimenSets)
    .innerJoin(placements, and(eq(placements.id, specimenSets.placementId), eq(placements.projectId, projectId)))
    .where(and(...conditions))
    .orderBy(asc(specimenSets.castAt), asc(specimenSets.setCode));
  const sets: SetRow[] = setRows.map(({ set, placement }) => ({ ...set, castAt: set.castAt, placement }));
  const setIds = sets.map((s) => s.id);
  const breakRows: LabBreak[] = setIds.length
    ? await db
        .select()
        .from(breaks)
        .where(and(eq(breaks.projectId, projectId), inArray(breaks.specimenSetId, setIds), isNull(breaks.deletedAt)))
        .orderBy(asc(breaks.testedAt), asc(breaks.id))
    : [];
  return { sets, breaks: breakRows };
}

async function projectMixes(projectId: string) {
  return db
    .select({ id: mixDesigns.id, code: mixDesigns.code, fcMPa: mixDesigns.fcMPa, fcAgeDays: mixDesigns.fcAgeDays })
    .from(mixDesigns)
    .where(and(eq(mixDesigns.projectId, projectId), isNull(mixDesigns.deletedAt)))
    .orderBy(asc(mixDesigns.code));
}

/** A set's placement's sensors: the loggers the set may be cured with (the set's `sensorId`). */
export type LabSetView = SetRow & { mixCode: string | null; breaks: LabBreak[]; tests: StrengthTestRow[]; sensors: { id: string; name: string }[] };

async function placementSensors(projectId: string, placementIds: string[]) {
  if (!placementIds.length) return [];
  return db
    .select({ id: temperatureSensors.id, name: temperatureSensors.name, placementId: temperatureSensors.placementId })
    .from(temperatureSensors)
    .where(and(eq(temperatureSensors.projectId, projectId), inArray(temperatureSensors.placementId, placementIds), isNull(temperatureSensors.deletedAt)))
    .orderBy(asc(temperatureSensors.name));
}

/** The specimen sets of a project (optionally of one placement) with their breaks and strength tests. */
export async function getProjectSets(access: ProjectAccess, query: unknown) {
  const q = parseOrThrow(setsQuerySchema, query ?? {});
  permit(access, "project.read");
  const { project } = access;
  const projectId = project.id;
  const [{ sets, breaks: breakRows }, mixes] = await Promise.all([loadProjectLab(projectId, q.placement), projectMixes(projectId)]);
  const tests = strengthTests(sets, breakRows);
  const sensors = await placementSensors(projectId, [...new Set(sets.map((s) => s.placement.id))]);
  const mixCode = new Map(mixes.map((m) => [m.id, m.code]));
  const views: LabSetView[] = sets.map((s) => ({
    ...s,
    mixCode: s.placement.mixId ? (mixCode.get(s.placement.mixId) ?? null) : null,
    breaks: breakRows.filter((b) => b.specimenSetId === s.id),
    tests: tests.filter((t) => t.setId === s.id),
    sensors: sensors.filter((x) => x.placementId === s.placement.id).map(({ id, name }) => ({ id, name })),
  }));
  return {
    project: { id: project.id, name: project.name, unitSystem: project.unitSystem, timeZone: project.timeZone },
    canEnterBreaks: allows(access, "break.write") || allows(access, "record.correct"),
    canEditSets: allows(access, "specimen.write") || allows(access, "record.correct"),
    sets: views,
  };
}

/**
 * ACI 318 acceptance per mix on one project: every mix that has specimen sets, or the one named
 * by `mix` (its id or code). An unknown mix is a 404.
 */
export async function getProjectAcceptance(access: ProjectAccess, query: unknown): Promise<{ mixes: MixAcceptance[] }> {
  const q = parseOrThrow(acceptanceQuerySchema, query ?? {});
  permit(access, "project.read");
  const { project } = access;
  const projectId = project.id;
  const [{ sets, breaks: breakRows }, allMixes] = await Promise.all([loadProjectLab(projectId), projectMixes(projectId)]);
  let mixes = allMixes.filter((m) => sets.some((s) => s.placement.mixId === m.id));
  if (q.mix) {
    const wanted = allMixes.find((m) => (UUID.test(q.mix!) ? m.id === q.mix : m.code.toLowerCase() === q.mix!.toLowerCase()));
    if (!wanted) throw notFound("Mix design");
    mixes = [wanted];
  }
  return {
    mixes: mixes.map((mix) => {
      const mixSets = sets.filter((s) => s.placement.mixId === mix.id);
      const ids = new Set(mixSets.map((s) => s.id));
      return mixAcceptance(mix, strengthTests(mixSets, breakRows.filter((b) => ids.has(b.specimenSetId))), project.unitSystem);
    }),
  };
}
