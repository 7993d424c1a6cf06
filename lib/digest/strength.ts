// Strength results of the day's breaks: cylinders grouped into strength tests and judged at the
// mix's design age against the individual-test limit. Pure.
import { STRUCTURAL_ADEQUACY_NOTE, evaluateAcceptance, formatStrength, mpaToPsi, psiToMPa, type UnitSystem } from "@/lib/concrete";
import { placementName, type DigestWarning, type Lookup } from "./checks";
import type { DigestDay, DigestMix, DigestPlacement } from "./types";

export type BreakGroup = {
  setCode: string;
  placement: DigestPlacement | undefined;
  mix: DigestMix | null;
  ageDays: number;
  strengthsMPa: number[];
  averageMPa: number;
  /** Judged only at the mix's design age (f'c age). */
  judged: boolean;
  low: boolean;
  limitMPa: number | null;
};

/** The day's breaks grouped into strength tests (one set, one age); judged at the mix's design age. */
export function breakGroups(day: DigestDay, { placement }: Lookup): BreakGroup[] {
  const units = day.project.unitSystem;
  const groups = new Map<string, BreakGroup>();
  for (const b of day.breaks) {
    const key = `${b.specimenSetId}:${b.ageDays}`;
    const p = placement(b.placementId);
    const group = groups.get(key) ?? { setCode: b.setCode, placement: p, ageDays: b.ageDays, strengthsMPa: [], averageMPa: 0, judged: false, low: false, limitMPa: null, mix: p?.mix ?? null };
    group.strengthsMPa.push(b.strengthMPa);
    groups.set(key, group);
  }
  const toUnits = (mpa: number) => (units === "SI" ? mpa : mpaToPsi(mpa));
  for (const g of groups.values()) {
    g.averageMPa = g.strengthsMPa.reduce((s, v) => s + v, 0) / g.strengthsMPa.length;
    if (g.mix && g.ageDays === g.mix.fcAgeDays) {
      // Published limits per unit system: judge in the project's units, not in converted MPa.
      const fc = Math.round(toUnits(g.mix.fcMPa) * 1000) / 1000;
      const verdict = evaluateAcceptance({ fc, tests: [toUnits(g.averageMPa)], unitSystem: units });
      g.judged = true;
      g.low = verdict.tests[0].lowIndividual;
      g.limitMPa = units === "SI" ? verdict.individualLimit : psiToMPa(verdict.individualLimit);
    }
  }
  return [...groups.values()];
}

// ACI 318-19 §26.12.3.1(b): no strength test below f'c − 3.5 MPa (500 psi), or 0.90 f'c above 35 MPa (5000 psi).
export function strengthWarnings(groups: BreakGroup[], units: UnitSystem): DigestWarning[] {
  return groups
    .filter((g) => g.low)
    .map((g) => ({
      tone: "danger" as const,
      kind: "low-strength" as const,
      title: `Low strength test: set ${g.setCode} (${placementName(g.placement)})`,
      detail:
        `${g.ageDays}-day average ${formatStrength(g.averageMPa, units)} of ${g.strengthsMPa.length} cylinders is below the ` +
        `${formatStrength(g.limitMPa!, units)} limit for f′c ${formatStrength(g.mix!.fcMPa, units)}. ${STRUCTURAL_ADEQUACY_NOTE}`,
      rule: "ACI 318-19 §26.12.3.1(b): no strength test more than 3.5 MPa (500 psi) below f′c when f′c ≤ 35 MPa (5000 psi), nor below 0.90 f′c above that.",
    }));
}
