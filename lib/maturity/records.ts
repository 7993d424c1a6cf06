// The office's copy of what the field panel reads from the device: one placement's sensors and
// reading batches, and the breaks of its mix on every placement of the project (the calibration).
import { and, eq, inArray, isNull } from "drizzle-orm";
import { db } from "@/db";
import { breaks, placements, sensorReadings, specimenSets, temperatureSensors } from "@/db/schema";
import { authorize } from "@/lib/auth/authorize";
import type { SessionUser } from "@/lib/auth/options";
import { assertUuid } from "@/lib/records/guards";

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export async function loadMaturityRecords(user: SessionUser, projectId: string, placementId: string, mixId: string | null) {
  assertUuid(projectId, "Project");
  assertUuid(placementId, "Placement");
  await authorize(user, "project.read", projectId);
  const sensors = await db
    .select()
    .from(temperatureSensors)
    .where(and(eq(temperatureSensors.projectId, projectId), eq(temperatureSensors.placementId, placementId), isNull(temperatureSensors.deletedAt)));
  const ids = sensors.map((s) => s.id);
  const batches = ids.length
    ? await db
        .select({ id: sensorReadings.id, sensorId: sensorReadings.sensorId, readings: sensorReadings.readings })
        .from(sensorReadings)
        .where(and(eq(sensorReadings.projectId, projectId), inArray(sensorReadings.sensorId, ids), isNull(sensorReadings.deletedAt)))
    : [];
  const mixBreaks = mixId
    ? await db
        .select({ ageDays: breaks.ageDays, strengthMPa: breaks.strengthMPa })
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
  return {
    // Plain JSON for the client component: the same shapes the device stores.
    sensors: sensors.map((s) => ({ id: s.id, name: s.name, location: s.location, loggingIntervalMinutes: s.loggingIntervalMinutes, endedAt: iso(s.endedAt) })),
    batches,
    breaks: mixBreaks.filter((b): b is { ageDays: number; strengthMPa: number } => typeof b.strengthMPa === "number"),
  };
}
