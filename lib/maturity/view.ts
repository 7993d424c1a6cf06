// The maturity view of one placement (field panel, office page and PDF): records as stored → the assessment from
// lib/concrete, the findings from lib/checks, and the words and chart series a screen shows.
// No React here, so the field and the office show the same figures and it is unit-tested.
import {
  DEFAULT_MATURITY_SETTINGS,
  assessPlacementMaturity,
  calibrateFromBreaks,
  formatStrength,
  maturityUnit,
  type Calibration,
  type MaturityAssessment,
  type MaturitySettings,
  type UnitSystem,
} from "@/lib/concrete";
import { localTimeText, maturityColdFindings, maturityGapFindings, maturityTargetFindings, type CheckSensor } from "@/lib/checks/maturity";
import { toCheckProject } from "@/lib/checks/records";
import type { CheckPlacement, CheckProject, Finding } from "@/lib/checks/types";
import { calibrationBreaks, type MixBreak, type SetLoggers } from "./set-maturity";

type Row = Record<string, unknown>;
const numberOr = <T,>(v: unknown, fallback: T): number | T => (typeof v === "number" && Number.isFinite(v) ? v : fallback);

/** The project's maturity settings (synced project fields), with the C1074 defaults where unset. */
export function settingsOf(project: Row): MaturitySettings {
  return {
    method: project.maturityMethod === "equivalent-age" ? "equivalent-age" : "nurse-saul",
    datumC: numberOr(project.maturityDatumC, DEFAULT_MATURITY_SETTINGS.datumC),
    activationEnergyJPerMol: numberOr(project.maturityActivationEnergyJPerMol, DEFAULT_MATURITY_SETTINGS.activationEnergyJPerMol),
    referenceC: DEFAULT_MATURITY_SETTINGS.referenceC,
  };
}

export type MaturityInput = {
  project: Row & { unitSystem: string; timeZone: string };
  placement: Row & { id: string };
  mixCode: string | null;
  sensors: Row[];
  /** Batches (records of type sensor-readings): `readings` as [ISO instant, °C] pairs. */
  batches: Row[];
  /** Breaks of the placement's mix (any placement), with their set's cast time and logger when known. */
  breaks: MixBreak[];
  /** The loggers attached to those sets and their readings; a set without one is standard-cured. */
  loggers?: SetLoggers;
  targetMPa: number | null;
  now: Date;
};

export type MaturityView = {
  settings: MaturitySettings;
  unit: string;
  calibration: Calibration | null;
  assessment: MaturityAssessment;
  findings: Finding[];
  sensorNames: Map<string, string>;
};

const live = (r: Row) => !r.deletedAt;

export function buildMaturityView(input: MaturityInput): MaturityView {
  const settings = settingsOf(input.project);
  const sensors = input.sensors.filter(live).sort((a, b) => String(a.name).localeCompare(String(b.name)));
  const bySensor = new Map<string, { at: Date; tempC: number }[]>(sensors.map((s) => [String(s.id), []]));
  for (const batch of input.batches.filter(live)) {
    const list = bySensor.get(String(batch.sensorId));
    if (!list || !Array.isArray(batch.readings)) continue;
    for (const [at, tempC] of batch.readings as [string, number][]) list.push({ at: new Date(at), tempC });
  }
  const calibration = input.mixCode === null ? null : calibrateFromBreaks(calibrationBreaks(input.breaks, input.loggers, settings), settings);
  const assessment = assessPlacementMaturity({
    sensors: sensors.map((s) => ({ id: String(s.id), name: String(s.name), readings: bySensor.get(String(s.id)) ?? [] })),
    settings,
    calibration,
    targetMPa: input.targetMPa,
  });
  const project: CheckProject = toCheckProject(input.project);
  const placement: CheckPlacement = {
    id: input.placement.id,
    element: String(input.placement.element ?? ""),
    leastDimensionMm: numberOr(input.placement.leastDimensionMm, null),
    plannedVolumeM3: numberOr(input.placement.plannedVolumeM3, null),
    plannedStart: new Date(String(input.placement.plannedStart)),
    mix: null,
  };
  const checkSensors: CheckSensor[] = sensors.map((s) => ({
    id: String(s.id),
    placementId: placement.id,
    name: String(s.name),
    loggingIntervalMinutes: numberOr(s.loggingIntervalMinutes, null),
    endedAt: s.endedAt ? new Date(String(s.endedAt)) : null,
  }));
  const readings = [...bySensor.entries()].flatMap(([sensorId, list]) => list.map((r) => ({ sensorId, ...r })));
  const findings = [
    ...maturityTargetFindings(project, placement, assessment, input.targetMPa),
    ...maturityColdFindings(project, placement, checkSensors, readings),
    ...maturityGapFindings(project, placement, checkSensors, readings, input.now),
  ];
  return {
    settings,
    unit: maturityUnit(settings.method),
    calibration,
    assessment,
    findings,
    sensorNames: new Map(sensors.map((s) => [String(s.id), String(s.name)])),
  };
}

/** "18.4 MPa", "at least 31.0 MPa (beyond the calibration)", "below 9.8 MPa (under the calibration)". */
export function estimateText(view: MaturityView, units: UnitSystem): string {
  const e = view.assessment.estimate;
  if (!e) return view.assessment.reason ?? "No estimate yet.";
  if (e.status === "estimate") return formatStrength(e.strengthMPa, units);
  if (e.status === "above-range") return `At least ${formatStrength(e.atLeastMPa, units)}: beyond the highest calibrated maturity, not extrapolated`;
  return `Below ${formatStrength(e.belowMPa, units)}: under the lowest calibrated maturity`;
}

export function targetText(view: MaturityView, timeZone: string): string {
  const t = view.assessment.target;
  const name = (id: string) => view.sensorNames.get(id) ?? "a sensor";
  switch (t.status) {
    case "no-target":
      return view.assessment.reason ?? "Enter a target strength.";
    case "refused":
      return t.reason;
    case "reached":
      return `Reached at ${localTimeText(t.at, timeZone)} (last at ${name(t.sensorId)})`;
    case "predicted":
      return `Expected ${localTimeText(t.at, timeZone)} at ${name(t.sensorId)}, if it stays at its last reading`;
    case "not-gaining":
      return `Not gaining maturity at ${name(t.sensorId)}: its last reading is at or below the datum temperature`;
  }
}

/** Chart rows per sensor, thinned to about `maxPoints` so a 100,000-reading record draws at once. */
export function chartSeries(view: MaturityView, maxPoints = 300): { id: string; name: string; points: { t: number; tempC: number; maturity: number }[] }[] {
  return view.assessment.sensors.map((s) => {
    const step = Math.max(1, Math.ceil(s.series.length / maxPoints));
    const points = s.series.filter((_, i) => i % step === 0 || i === s.series.length - 1).map((p) => ({ t: p.at.getTime(), tempC: p.tempC, maturity: p.maturity }));
    return { id: s.id, name: s.name, points };
  });
}

// ASTM C1074 and the trade's practice [memory]: said beside every estimate, on every surface.
export const MATURITY_CAUTIONS = [
  "The estimate holds only for the calibrated mix and within its calibrated range; it is never extended beyond the highest calibrated maturity.",
  "ASTM C1074 asks that the estimate be confirmed by other tests (field-cured cylinders, cores or in-place tests) before critical operations such as form removal or post-tensioning.",
  "The project specification, the formwork engineer and the engineer of record decide when forms come off, tendons are stressed or the slab is loaded.",
];
