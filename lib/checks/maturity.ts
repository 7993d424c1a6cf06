// The maturity rules of the rulebook: target strength reached (ASTM C1074 estimate), a sensor below
// the cold-weather minimum during protection (ACI 306R), and a hole in a sensor's record. Pure:
// every threshold and every calculation is called from lib/concrete.
import {
  findReadingGaps,
  formatStrength,
  formatTemperature,
  loggingIntervalMinutes,
  minimumConcreteTempC,
  protectionPeriodDays,
  toDisplay,
  unitLabel,
  type MaturityAssessment,
} from "@/lib/concrete";
import { zonedParts } from "@/lib/time/zone";
import { GOVERNS, type CheckPlacement, type CheckProject, type Finding } from "./types";

/** A temperature sensor cast into a placement, as stored. */
export type CheckSensor = {
  id: string;
  placementId: string;
  name: string;
  /** The logger's interval; null = judged from the record itself (median spacing). */
  loggingIntervalMinutes: number | null;
  /** When monitoring ended (sensor cut off, record closed); null while still monitored. */
  endedAt: Date | null;
};
export type CheckSensorReading = { sensorId: string; at: Date; tempC: number };

const C1074 = { document: "ASTM C1074", basis: "memory" } as const;
const pad = (n: number) => String(n).padStart(2, "0");

/** A project-local wall-clock time for titles ("2026-11-05 14:20"). */
export function localTimeText(instant: Date, timeZone: string): string {
  const p = zonedParts(instant, timeZone);
  return `${p.year}-${pad(p.month)}-${pad(p.day)} ${pad(p.hour)}:${pad(p.minute)}`;
}

const CONFIRM =
  "ASTM C1074 asks that the estimate be confirmed by other tests (field-cured cylinders, cores or in-place tests) before form removal, post-tensioning or loading; the project specification, the formwork engineer and the engineer of record decide.";

// ASTM C1074: the in-place estimate at the coldest sensor reaches the target (only within the calibration).
export function maturityTargetFindings(
  project: CheckProject,
  placement: CheckPlacement,
  assessment: MaturityAssessment,
  targetMPa: number | null,
): Finding[] {
  const t = assessment.target;
  if (targetMPa === null || t.status !== "reached") return [];
  const at = localTimeText(t.at, project.timeZone);
  const target = formatStrength(targetMPa, project.unitSystem);
  return [
    {
      rule: "maturity-target",
      severity: "info",
      subject: { type: "sensor", id: t.sensorId },
      placementId: placement.id,
      at: t.at.toISOString(),
      title: `Target strength ${target} estimated as reached at ${at}`,
      message: `By the maturity method, every sensor of ${placement.element} had reached the maturity of ${target} on the mix's calibration by ${at}. ${CONFIRM}`,
      applied: { value: toDisplay("strength", targetMPa, project.unitSystem), limit: toDisplay("strength", targetMPa, project.unitSystem), unit: unitLabel("strength", project.unitSystem) },
      source: C1074,
      governs: GOVERNS,
    },
  ];
}

// ACI 306R [memory]: the protection period the rulebook watches when the project sets none (exposed, no load).
const defaultProtectionDays = () => protectionPeriodDays({ serviceCategory: "no-load-exposed" }) ?? 0;

// ACI 306R: concrete kept at or above the section's minimum temperature for the protection period.
export function maturityColdFindings(
  project: CheckProject,
  placement: CheckPlacement,
  sensors: CheckSensor[],
  readings: CheckSensorReading[],
  protectionDays: number = defaultProtectionDays(),
): Finding[] {
  if (placement.leastDimensionMm === null) return [];
  const minC = minimumConcreteTempC(placement.leastDimensionMm, project.unitSystem);
  const from = placement.plannedStart.getTime();
  const to = from + protectionDays * 86_400_000;
  return sensors.flatMap((sensor) => {
    const cold = readings
      .filter((r) => r.sensorId === sensor.id && r.at.getTime() >= from && r.at.getTime() <= to && r.tempC < minC)
      .sort((a, b) => a.tempC - b.tempC || a.at.getTime() - b.at.getTime());
    if (cold.length === 0) return [];
    const low = cold[0];
    const unit = unitLabel("temperature", project.unitSystem);
    return [
      {
        rule: "maturity-cold" as const,
        severity: "warning" as const,
        subject: { type: "sensor" as const, id: sensor.id },
        placementId: placement.id,
        at: low.at.toISOString(),
        title: `Sensor ${sensor.name} read ${formatTemperature(low.tempC, project.unitSystem, 1)}, below the ${formatTemperature(minC, project.unitSystem)} minimum during protection`,
        message: `${cold.length} reading${cold.length === 1 ? "" : "s"} of this sensor during the protection period fell below the minimum concrete temperature for this section (lowest at ${localTimeText(low.at, project.timeZone)}). Check the enclosure and heaters, and tell the engineer of record; early freezing can harm the concrete.`,
        applied: { value: toDisplay("temperature", low.tempC, project.unitSystem), limit: toDisplay("temperature", minC, project.unitSystem), unit },
        source: { document: "ACI 306R", basis: "memory" as const },
        governs: GOVERNS,
      },
    ];
  });
}

const minutesText = (minutes: number) => (minutes >= 120 ? `${(minutes / 60).toFixed(1)} h` : `${Math.round(minutes)} min`);

// ASTM C1074: the maturity is only as good as a continuous record; a hole or a silent sensor is reported.
export function maturityGapFindings(
  project: CheckProject,
  placement: CheckPlacement,
  sensors: CheckSensor[],
  readings: CheckSensorReading[],
  now: Date,
): Finding[] {
  return sensors.flatMap((sensor) => {
    const times = readings
      .filter((r) => r.sensorId === sensor.id)
      .map((r) => r.at)
      .sort((a, b) => a.getTime() - b.getTime());
    const interval = sensor.loggingIntervalMinutes ?? loggingIntervalMinutes(times);
    if (interval === null) return [];
    const gaps = findReadingGaps(times, interval, sensor.endedAt ? undefined : now);
    return gaps.map((gap) => ({
      rule: "maturity-gap" as const,
      severity: "caution" as const,
      subject: { type: "sensor" as const, id: sensor.id },
      placementId: placement.id,
      at: gap.from.toISOString(),
      title:
        gap.kind === "stopped"
          ? `Sensor ${sensor.name} has sent no reading for ${minutesText(gap.minutes)}`
          : `Sensor ${sensor.name} has a ${minutesText(gap.minutes)} gap in its record from ${localTimeText(gap.from, project.timeZone)}`,
      message:
        gap.kind === "stopped"
          ? `The logger reads every ${Math.round(interval)} min. Check the sensor and its logger; until readings resume the maturity, the estimate and the time to target stop at the last reading.`
          : `The logger reads every ${Math.round(interval)} min. Across the gap the maturity is computed from the readings either side, which may miss a cold spell; download the logger again if it holds the missing readings.`,
      applied: { value: Math.round(gap.minutes), limit: Math.round(interval), unit: "min" },
      source: C1074,
      governs: GOVERNS,
    }));
  });
}
