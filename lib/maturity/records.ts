// What the maturity view of a placement reads on the server (the office page and the PDF): its
// sensors and reading batches, and the breaks of its mix on every placement of the project (the
// calibration), in the same shapes the device stores.
import { and, asc, eq, gte, inArray, isNull, lt } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { breaks, mixDesigns, placements, projects, sensorReadings, specimenSets, temperatureSensors } from "@/db/schema";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { assertUuid } from "@/lib/records/guards";

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export type MaturityRecords = Awaited<ReturnType<typeof readMaturityRecords>>;

/**
 * One placement's sensors and batches (readings before `until`, when given) and its mix's breaks.
 * The calibration uses every break known now, even for a past day: it describes the mix, not the day.
 */
export async function readMaturityRecords(tx: Executor, projectId: string, placementId: string, mixId: string | null, until?: Date) {
  const sensors = await tx
    .select()
    .from(temperatureSensors)
    .where(and(eq(temperatureSensors.projectId, projectId), eq(temperatureSensors.placementId, placementId), isNull(temperatureSensors.deletedAt)))
    .orderBy(asc(temperatureSensors.name));
  const ids = sensors.map((s) => s.id);
  const rows = ids.length
    ? await tx
        .select({ id: sensorReadings.id, sensorId: sensorReadings.sensorId, readings: sensorReadings.readings })
        .from(sensorReadings)
        .where(
          and(
            eq(sensorReadings.projectId, projectId),
            inArray(sensorReadings.sensorId, ids),
            isNull(sensorReadings.deletedAt),
            until ? lt(sensorReadings.firstAt, until) : undefined,
          ),
        )
    : [];
  // A batch that runs past `until` is cut there: a report of a past day shows that day's estimate.
  const batches = until ? rows.map((b) => ({ ...b, readings: b.readings.filter(([at]) => Date.parse(at) < until.getTime()) })) : rows;
  const mixBreaks = mixId
    ? await tx
        .select({
          ageDays: breaks.ageDays,
          strengthMPa: breaks.strengthMPa,
          testedAt: breaks.testedAt,
          castAt: specimenSets.castAt,
          sensorId: specimenSets.sensorId,
        })
        .from(breaks)
        .innerJoin(specimenSets, eq(specimenSets.id, breaks.specimenSetId))
        .innerJoin(placements, eq(placements.id, specimenSets.placementId))
        .where(
          and(
            eq(breaks.projectId, projectId),
            eq(placements.mixId, mixId),
            isNull(breaks.deletedAt),
            isNull(specimenSets.deletedAt),
            isNull(placements.deletedAt),
          ),
        )
    : [];
  const valid = mixBreaks.filter((b) => typeof b.strengthMPa === "number");
  return {
    sensors: sensors.map((s) => ({ id: s.id, name: s.name, location: s.location, loggingIntervalMinutes: s.loggingIntervalMinutes, endedAt: iso(s.endedAt) })),
    batches,
    breaks: valid.map((b) => ({ ...b, testedAt: iso(b.testedAt), castAt: iso(b.castAt) })),
    loggers: await readSetLoggers(tx, projectId, [...new Set(valid.map((b) => b.sensorId).filter((id): id is string => id !== null))]),
  };
}

/** The loggers attached to specimen sets and all their readings (a break may come after `until`). */
async function readSetLoggers(tx: Executor, projectId: string, ids: string[]) {
  if (!ids.length) return { sensors: [], batches: [] };
  const sensors = await tx
    .select({ id: temperatureSensors.id, name: temperatureSensors.name, deletedAt: temperatureSensors.deletedAt })
    .from(temperatureSensors)
    .where(and(eq(temperatureSensors.projectId, projectId), inArray(temperatureSensors.id, ids)));
  const batches = await tx
    .select({ id: sensorReadings.id, sensorId: sensorReadings.sensorId, readings: sensorReadings.readings })
    .from(sensorReadings)
    .where(and(eq(sensorReadings.projectId, projectId), inArray(sensorReadings.sensorId, ids), isNull(sensorReadings.deletedAt)));
  return { sensors: sensors.map((s) => ({ ...s, deletedAt: iso(s.deletedAt) })), batches };
}

export async function loadMaturityRecords(access: ProjectAccess, placementId: string, mixId: string | null) {
  assertUuid(placementId, "Placement");
  permit(access, "project.read");
  return readMaturityRecords(db, access.project.id, placementId, mixId);
}

/**
 * The placements whose temperature record runs during [start, end) (a report's day), each with its
 * records up to `end`, the project row and the mix code: what the PDF's maturity section shows.
 */
export async function maturityOfPeriod(tx: Executor, projectId: string, start: Date, end: Date) {
  const active = await tx
    .selectDistinct({ placementId: temperatureSensors.placementId })
    .from(sensorReadings)
    .innerJoin(temperatureSensors, eq(temperatureSensors.id, sensorReadings.sensorId))
    .where(
      and(
        eq(sensorReadings.projectId, projectId),
        isNull(sensorReadings.deletedAt),
        isNull(temperatureSensors.deletedAt),
        lt(sensorReadings.firstAt, end),
        gte(sensorReadings.lastAt, start),
      ),
    );
  if (!active.length) return [];
  const [project] = await tx.select().from(projects).where(eq(projects.id, projectId));
  const rows = await tx
    .select({ placement: placements, mixCode: mixDesigns.code })
    .from(placements)
    .leftJoin(mixDesigns, eq(mixDesigns.id, placements.mixId))
    .where(and(eq(placements.projectId, projectId), inArray(placements.id, active.map((a) => a.placementId)), isNull(placements.deletedAt)))
    .orderBy(asc(placements.plannedStart));
  return Promise.all(
    rows.map(async ({ placement, mixCode }) => ({
      project,
      placement,
      mixCode,
      records: await readMaturityRecords(tx, projectId, placement.id, placement.mixId, end),
    })),
  );
}
