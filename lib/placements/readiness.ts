// The readiness check before a placement: the superintendent answers each item (yes / no / not
// applicable, with a note) and marks the placement ready; the inspector then clears or holds it.
// Pure: used by the field screen to say what is still missing before "Ask for inspection" is offered.
// The items follow the pre-placement inspection common to concrete inspection guides (forms,
// reinforcement and cover, embedded items, cleanliness, access and placing equipment, consolidation,
// weather protection, testing) [common practice]; the project specification governs the real list.

export type ReadinessItemDef = { itemKey: string; label: string };

/** The default readiness list (item keys as in the demo data, so seeded lists sort the same way). */
export const READINESS_ITEMS: readonly ReadinessItemDef[] = [
  { itemKey: "forms", label: "Forms tight, braced and clean" },
  { itemKey: "reinforcement", label: "Reinforcement as drawn, tied and supported" },
  { itemKey: "cover", label: "Cover to reinforcement as specified" },
  { itemKey: "embeds", label: "Embeds, sleeves and blockouts in place" },
  { itemKey: "cleanliness", label: "Forms free of debris, water and ice" },
  { itemKey: "access", label: "Access for trucks and pump" },
  { itemKey: "pump", label: "Pump set up and primed" },
  { itemKey: "vibrators", label: "Standby vibrators on site" },
  { itemKey: "weather-plan", label: "Weather plan: protection, curing and cover materials ready" },
  { itemKey: "testing-crew", label: "Testing crew on site with equipment for the field tests" },
];

export type ReadinessAnswer = "yes" | "no" | "na";
export type ReadinessItem = { itemKey: string; label: string; answer: ReadinessAnswer | null | undefined; note?: string | null };

export type ReadinessVerdict = { ready: boolean; answered: number; total: number; noCount: number; problems: string[] };

const hasText = (s: string | null | undefined) => typeof s === "string" && s.trim().length > 0;

/**
 * What still stands between this readiness checklist and "Ask for inspection":
 * - there must be a readiness checklist with at least one item;
 * - every item must be answered (yes, no or not applicable);
 * - a "no" must say what is wrong and what is being done (a note), so the inspector can judge it;
 * - "not applicable" must say why as well, so a skipped item is never silent.
 * A "no" with a note does not block: the inspector decides whether to clear or hold.
 */
export function readinessVerdict(items: readonly ReadinessItem[] | null | undefined): ReadinessVerdict {
  if (!items || items.length === 0) {
    return { ready: false, answered: 0, total: 0, noCount: 0, problems: ["Fill in the readiness checklist first."] };
  }
  const problems: string[] = [];
  const unanswered = items.filter((i) => !i.answer);
  if (unanswered.length) {
    problems.push(`${unanswered.length} ${unanswered.length === 1 ? "item is" : "items are"} not answered: ${unanswered.map((i) => i.label).join("; ")}.`);
  }
  for (const item of items) {
    if (item.answer === "no" && !hasText(item.note)) problems.push(`Say what is wrong and what is being done for "${item.label}".`);
    if (item.answer === "na" && !hasText(item.note)) problems.push(`Say why "${item.label}" does not apply.`);
  }
  return {
    ready: problems.length === 0,
    answered: items.length - unanswered.length,
    total: items.length,
    noCount: items.filter((i) => i.answer === "no").length,
    problems,
  };
}

/** Sort order of a readiness list: the default items in their order, anything else after, by label. */
export function readinessOrder(a: { itemKey: string; label: string }, b: { itemKey: string; label: string }): number {
  const rank = (k: string) => {
    const i = READINESS_ITEMS.findIndex((d) => d.itemKey === k);
    return i === -1 ? READINESS_ITEMS.length : i;
  };
  return rank(a.itemKey) - rank(b.itemKey) || a.label.localeCompare(b.label);
}
