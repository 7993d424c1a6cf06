// A field test's measured values beside the rulebook's ranges (lib/checks), for the form and the list.
import { toCheckMix, toCheckProject, type Finding } from "@/lib/checks";
import { airRangeFor, maxTemperatureFor, slumpRangeFor } from "@/lib/checks/field-tests";
import { formatLength, type UnitSystem } from "@/lib/concrete";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";
import { unitLabel } from "./unit-inputs";
import { Verdict } from "./verdict-badges";

export type Results = { slumpMm?: number; airPct?: number; concreteTempC?: number };
type Verdicts = { slump?: { ok: boolean; range: string }; air?: { ok: boolean; range: string }; temperature?: { ok: boolean; range: string } };

/**
 * Each measured value beside the range it was judged against; the verdict is the rulebook's (a finding
 * of that rule on this test means out of range). The ranges are the rulebook's too: the mix's own
 * tolerance, else ASTM C94's, and the maximum temperature of the mix, else the project.
 */
export function verdictsOf(found: Finding[], results: Results, mix: LocalRecord<"mix-designs"> | null, project: ProjectRow, units: UnitSystem): Verdicts {
  const out: Verdicts = {};
  const m = mix ? toCheckMix(mix) : null;
  const has = (rule: Finding["rule"]) => found.some((f) => f.rule === rule);
  const slump = m && slumpRangeFor(m, units);
  if (results.slumpMm !== undefined && slump) out.slump = { ok: !has("slump"), range: `${slump.min > 0 ? `${formatLength(slump.min, units)} to ` : "up to "}${formatLength(slump.max, units)}` };
  const air = m && airRangeFor(m);
  if (results.airPct !== undefined && air) out.air = { ok: !has("air-content"), range: `${air.min.toFixed(1)} to ${air.max.toFixed(1)} %` };
  if (results.concreteTempC !== undefined) {
    const { max } = maxTemperatureFor(m, toCheckProject(project));
    out.temperature = { ok: !has("concrete-temperature"), range: `at most ${max} ${unitLabel("temperature", units)}` };
  }
  return out;
}

// The concrete temperature has only a maximum, so its words say so rather than "out of tolerance".
const WORDS: Record<string, { ok: string; bad: string }> = { Temperature: { ok: "Temperature within the maximum", bad: "Above the maximum temperature" } };

export function VerdictLine({ label, verdict, testId }: { label: string; verdict?: { ok: boolean; range: string }; testId: string }) {
  if (!verdict) return null;
  return (
    <span className="flex flex-wrap items-center gap-1 text-sm">
      <Verdict ok={verdict.ok} testId={testId} okText={WORDS[label]?.ok ?? `${label} in tolerance`} badText={WORDS[label]?.bad ?? `${label} out of tolerance`} />
      <span className="text-muted">({verdict.range})</span>
    </span>
  );
}

