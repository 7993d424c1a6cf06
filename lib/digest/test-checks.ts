// Warnings about the day's fresh-concrete tests against the mix's tolerances.
import {
  airRangePct,
  formatLength,
  formatTemperature,
  slumpRangeMm,
  toDisplay,
  withinRange,
  type NumericRange,
  type UnitSystem,
} from "@/lib/concrete";
import { placementName, truckName, type DigestWarning, type Lookup } from "./checks";
import type { DigestDay, DigestFieldTest, DigestMix } from "./types";

function slumpRange(mix: DigestMix, units: UnitSystem): NumericRange {
  const target = mix.slumpTargetMm!;
  if (mix.slumpToleranceMm === null) return slumpRangeMm(target, mix.slumpType, units);
  const tol = mix.slumpToleranceMm;
  return mix.slumpType === "maximum" ? { min: Math.max(0, target - tol), max: target } : { min: Math.max(0, target - tol), max: target + tol };
}

/** The properties of one test that are outside the mix's tolerances, as "Slump 6.5 in (range 3.0–5.0 in)". */
export function testProblems(test: DigestFieldTest, mix: DigestMix | null, day: DigestDay): string[] {
  const units = day.project.unitSystem;
  const problems: string[] = [];
  const digits = units === "SI" ? 0 : 1;
  if (mix && test.slumpMm !== null && mix.slumpTargetMm !== null) {
    const range = slumpRange(mix, units);
    if (!withinRange(test.slumpMm, range)) {
      const min = toDisplay("length", range.min, units).toFixed(digits);
      problems.push(`slump ${formatLength(test.slumpMm, units)} outside ${min}–${formatLength(range.max, units)}`);
    }
  }
  if (mix && test.airPct !== null && mix.airTargetPct !== null) {
    const range = mix.airTolerancePct === null ? airRangePct(mix.airTargetPct) : { min: Math.max(0, mix.airTargetPct - mix.airTolerancePct), max: mix.airTargetPct + mix.airTolerancePct };
    if (!withinRange(test.airPct, range)) problems.push(`air ${test.airPct.toFixed(1)} % outside ${range.min.toFixed(1)}–${range.max.toFixed(1)} %`);
  }
  const maxC = mix?.maxConcreteTempC ?? day.project.maxConcreteTempC;
  if (test.concreteTempC !== null && test.concreteTempC > maxC) {
    problems.push(`concrete ${formatTemperature(test.concreteTempC, units)} above the ${formatTemperature(maxC, units)} maximum`);
  }
  return problems;
}

// ASTM C94 §7 tolerances for slump and air; ACI 305.1 §3.3.1 maximum temperature at discharge.
export function testWarnings(day: DigestDay, { placement, time }: Lookup): DigestWarning[] {
  const ticket = new Map(day.deliveries.map((d) => [d.id, d]));
  return day.fieldTests.flatMap((test) => {
    const p = placement(test.placementId);
    const problems = testProblems(test, p?.mix ?? null, day);
    if (problems.length === 0) return [];
    const delivery = test.deliveryId ? ticket.get(test.deliveryId) : undefined;
    const laterPass = day.fieldTests.some(
      (t) => t.deliveryId !== null && t.deliveryId === test.deliveryId && t.sampledAt > test.sampledAt && testProblems(t, p?.mix ?? null, day).length === 0,
    );
    const problemText = problems.join("; ");
    return [
      {
        tone: "danger" as const,
        kind: "test" as const,
        title: `Test out of tolerance at ${time(test.sampledAt)}${delivery ? `, ${truckName(delivery)}` : ""}`,
        detail: `${problemText.charAt(0).toUpperCase()}${problemText.slice(1)} (${placementName(p)}).${laterPass ? " A check test on the same load was within tolerance." : ""}`,
        rule: "ASTM C94 §7 tolerances for slump and air content; ACI 305.1 maximum concrete temperature at discharge.",
      },
    ];
  });
}
