// What a fresh-concrete test means against the mix: slump and air content within the mix's tolerance
// (its own, else ASTM C94's), concrete temperature at or below the maximum (mix, else project, else
// ACI 305.1's 35 °C / 95 °F). A later test of the same load within range is ASTM C94's check test.
import {
  CHECK_TEST_NOTE,
  airRangePct,
  formatLength,
  formatTemperature,
  slumpRangeMm,
  temperatureInUnits,
  toDisplay,
  unitLabel,
  withinRange,
  type NumericRange,
  type UnitSystem,
} from "@/lib/concrete";
import { GOVERNS, type CheckFieldTest, type CheckMix, type CheckProject, type Finding, type Source } from "./types";

/** ACI 305.1-14 §3.3.1 / ACI 301 default maximum at discharge, per unit system. */
const DEFAULT_MAX_TEMP = { SI: 35, IP: 95 } as const;

// The mix's own tolerance where it states one; otherwise ASTM C94's band for the target (in the project's units).
export function slumpRangeFor(mix: Pick<CheckMix, "slumpTargetMm" | "slumpType" | "slumpToleranceMm">, unitSystem: UnitSystem): NumericRange | null {
  if (mix.slumpTargetMm === null) return null;
  const target = mix.slumpTargetMm;
  if (mix.slumpToleranceMm === null) return slumpRangeMm(target, mix.slumpType, unitSystem);
  const tol = mix.slumpToleranceMm;
  return { min: Math.max(0, target - tol), max: mix.slumpType === "maximum" ? target : target + tol };
}

export function airRangeFor(mix: Pick<CheckMix, "airTargetPct" | "airTolerancePct">): NumericRange | null {
  if (mix.airTargetPct === null) return null;
  if (mix.airTolerancePct === null) return airRangePct(mix.airTargetPct);
  return { min: Math.max(0, mix.airTargetPct - mix.airTolerancePct), max: mix.airTargetPct + mix.airTolerancePct };
}

/** The maximum concrete temperature that applies, in °C as stored, and where it comes from. */
export function maxTemperatureFor(mix: Pick<CheckMix, "maxConcreteTempC"> | null, project: CheckProject): { maxC: number; max: number; source: Source } {
  const units = project.unitSystem;
  const maxC = mix?.maxConcreteTempC ?? project.maxConcreteTempC;
  const max = temperatureInUnits(maxC, units);
  const source: Source =
    mix?.maxConcreteTempC == null && max === DEFAULT_MAX_TEMP[units]
      ? { document: "ACI 305.1", edition: "14", clause: "§3.3.1", basis: "published" }
      : { document: mix?.maxConcreteTempC != null ? "Mix design (project specification)" : "Project specification", basis: "project" };
  return { maxC, max, source };
}

const C94_TOLERANCE: Source = { document: "ASTM C94", clause: "slump and air content tolerances", basis: "memory" };

const lengthRange = (r: NumericRange, units: UnitSystem) =>
  `${toDisplay("length", r.min, units).toFixed(units === "SI" ? 0 : 1)}–${formatLength(r.max, units)}`;

/** The findings of one test; `checkTestPassed` when a later test of the same load was within range. */
export function fieldTestFindings(test: CheckFieldTest, mix: CheckMix | null, project: CheckProject, checkTestPassed = false): Finding[] {
  const units = project.unitSystem;
  const findings: Finding[] = [];
  const base = { subject: { type: "field-test" as const, id: test.id }, placementId: test.placementId, at: test.sampledAt.toISOString(), governs: GOVERNS };
  // A failure cleared by a passing check test stays on record as a caution.
  const followUp = checkTestPassed
    ? " A check test on the same load was within range, so the load conforms."
    : ` ${CHECK_TEST_NOTE}`;
  const slump = mix && slumpRangeFor(mix, units);
  if (slump && test.slumpMm !== null && !withinRange(test.slumpMm, slump)) {
    findings.push({
      ...base,
      rule: "slump",
      severity: checkTestPassed ? "caution" : "warning",
      title: `Slump out of tolerance: ${formatLength(test.slumpMm, units)} (range ${lengthRange(slump, units)})`,
      message: `The mix ${mix.code} allows ${lengthRange(slump, units)}${mix.slumpToleranceMm === null ? " (ASTM C94 tolerance for the specified slump)" : ""}.${followUp}`,
      applied: { value: toDisplay("length", test.slumpMm, units), limit: toDisplay("length", test.slumpMm < slump.min ? slump.min : slump.max, units), unit: unitLabel("length", units) },
      source: mix.slumpToleranceMm === null ? C94_TOLERANCE : { document: "Mix design (project specification)", basis: "project" },
    });
  }
  const air = mix && airRangeFor(mix);
  if (air && test.airPct !== null && !withinRange(test.airPct, air)) {
    const range = `${air.min.toFixed(1)}–${air.max.toFixed(1)} %`;
    findings.push({
      ...base,
      rule: "air-content",
      severity: checkTestPassed ? "caution" : "warning",
      title: `Air content out of tolerance: ${test.airPct.toFixed(1)} % (range ${range})`,
      message: `The mix ${mix.code} allows ${range}${mix.airTolerancePct === null ? " (ASTM C94: ±1.5 percentage points)" : ""}.${followUp}`,
      applied: { value: test.airPct, limit: test.airPct < air.min ? air.min : air.max, unit: "%" },
      source: mix.airTolerancePct === null ? C94_TOLERANCE : { document: "Mix design (project specification)", basis: "project" },
    });
  }
  if (test.concreteTempC !== null) {
    const { max, source } = maxTemperatureFor(mix, project);
    const value = temperatureInUnits(test.concreteTempC, units);
    if (value > max) {
      const unit = unitLabel("temperature", units);
      findings.push({
        ...base,
        rule: "concrete-temperature",
        severity: "warning",
        title: `Above the maximum temperature: ${formatTemperature(test.concreteTempC, units, 1)} (maximum ${max} ${unit})`,
        message:
          `The maximum concrete temperature at discharge is ${max} ${unit}. The limit comes from the project specification (ACI 301 / ACI 305.1 default 35 °C, 95 °F), not ASTM C94's check test. ` +
          "Cool the materials or place in cooler hours; what happens to the load is the purchaser's decision.",
        applied: { value, limit: max, unit },
        source,
      });
    }
  }
  return findings;
}

/** Whether any test of the same load taken after `test` is within every range (a passing check test). */
export function laterCheckTestPassed(test: CheckFieldTest, all: CheckFieldTest[], mix: CheckMix | null, project: CheckProject): boolean {
  if (test.deliveryId === null) return false;
  return all.some(
    (t) => t.deliveryId === test.deliveryId && t.sampledAt > test.sampledAt && fieldTestFindings(t, mix, project).length === 0,
  );
}
