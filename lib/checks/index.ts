// The rulebook: what the records of a project mean under the published rules and the project's own
// settings. Every surface (field screens offline, the server's stored findings, the digest, the
// review table, the placement review page and the PDF) shows findings made here and nowhere else.
import { localDate } from "@/lib/time/zone";
import { coldWeatherFindings, curingFinding } from "./cold-weather";
import { dischargeFinding, mixCodeFinding, revolutionsFinding, siteWaterFinding } from "./delivery";
import { fieldTestFindings, laterCheckTestPassed } from "./field-tests";
import { samplingFindings } from "./sampling";
import { strengthFindings } from "./strength";
import { SEVERITIES, type CheckInput, type Finding, type Severity } from "./types";
import { evaporationFinding, hotWeatherFindings } from "./weather";

export * from "./types";

export type EvaluateOptions = {
  /** The time now, for what depends on it (a truck still discharging); omit on the server. */
  now?: Date;
};

/** Every finding of the records in `input`, info included, in a stable order. */
export function evaluate(input: CheckInput, options: EvaluateOptions = {}): Finding[] {
  const { project } = input;
  const placement = new Map(input.placements.map((p) => [p.id, p]));
  const mixOf = (placementId: string | null) => (placementId ? (placement.get(placementId)?.mix ?? null) : null);
  const findings: Finding[] = [];
  for (const w of input.weather) findings.push(evaporationFinding(w, project, mixOf(w.placementId)));
  findings.push(...hotWeatherFindings(input));
  findings.push(...coldWeatherFindings(input));
  for (const c of input.curing) {
    const f = curingFinding(c, placement.get(c.placementId), project);
    if (f) findings.push(f);
  }
  for (const d of input.deliveries) {
    for (const f of [dischargeFinding(d, project, options.now), revolutionsFinding(d, project), siteWaterFinding(d, mixOf(d.placementId), project), mixCodeFinding(d, mixOf(d.placementId))]) {
      if (f) findings.push(f);
    }
  }
  for (const t of input.fieldTests) {
    const mix = mixOf(t.placementId);
    findings.push(...fieldTestFindings(t, mix, project, laterCheckTestPassed(t, input.fieldTests, mix, project)));
  }
  findings.push(...strengthFindings(input));
  findings.push(...samplingFindings(input));
  return findings.sort(byTime);
}

/**
 * The kinds of record the rulebook judges one at a time: every finding about such a record is
 * decided by the record, its placement (with the mix) and the project alone, and the record counts
 * towards no other finding except one that the new records produce by themselves whenever adding
 * them can change it (no cylinders made: a placement's accepted trucks, lib/checks/sampling.ts).
 * lib/findings judges new records of these kinds on their own instead of reading their days again.
 * A rule that reads these records across records (a day's total, a comparison between trucks)
 * breaks this: take the kind out of this list in the same change.
 */
export const JUDGED_ONE_BY_ONE = { deliveries: "delivery", curing: "curing" } as const satisfies Partial<Record<keyof CheckInput, Finding["subject"]["type"]>>;

const byTime = (a: Finding, b: Finding) => a.at.localeCompare(b.at) || a.rule.localeCompare(b.rule) || a.subject.id.localeCompare(b.subject.id);

const rank = (s: Severity) => SEVERITIES.indexOf(s);

/** What a person must see: cautions and warnings, most severe first. */
export function attention(findings: Finding[]): Finding[] {
  return findings.filter((f) => f.severity !== "info").sort((a, b) => rank(b.severity) - rank(a.severity) || byTime(a, b));
}

/** The findings that belong to a project-local date: day-level ones by their date, others by their time. */
export function onDate(findings: Finding[], date: string, timeZone: string): Finding[] {
  return findings.filter((f) => (f.subject.type === "day" ? f.subject.id === date : localDate(new Date(f.at), timeZone) === date));
}

/** The most severe level among findings, or null when there are none. */
export function worst(findings: Finding[]): Severity | null {
  return findings.reduce<Severity | null>((w, f) => (w === null || rank(f.severity) > rank(w) ? f.severity : w), null);
}
export * from "./records";
