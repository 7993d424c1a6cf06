// Whether strength specimens were made for a placement of structural concrete. A mix specified by
// f'c is accepted on strength tests (ACI 318-19 §26.12.2.1: samples at least once a day for each
// class of concrete), so concrete placed from such a mix with no specimen set is a gap in the record.
import { GOVERNS, type CheckInput, type Finding } from "./types";

/**
 * One finding per placement whose mix names f'c, that has accepted concrete and no specimen set.
 * The small-quantity waiver (under 38 m³ / 50 yd³, with the building official's agreement) and any
 * other arrangement are the project's to decide, so this is a caution, not a verdict.
 */
export function samplingFindings(input: Pick<CheckInput, "placements" | "deliveries" | "specimenSets">): Finding[] {
  const withSets = new Set(input.specimenSets.map((s) => s.placementId));
  const findings: Finding[] = [];
  for (const p of input.placements) {
    if (!p.mix || !(p.mix.fcMPa > 0) || withSets.has(p.id)) continue;
    const accepted = input.deliveries.filter((d) => d.placementId === p.id && d.status === "accepted" && d.volumeM3 > 0);
    if (accepted.length === 0) continue;
    findings.push({
      rule: "sampling-frequency",
      severity: "caution",
      subject: { type: "placement", id: p.id },
      placementId: p.id,
      // On the placement's planned day: the day the office reviews it and the day loader reads it whole.
      at: p.plannedStart.toISOString(),
      title: `No cylinders made: ${p.element}, mix ${p.mix.code}`,
      message:
        `Concrete from a mix specified by strength was placed (${accepted.length} ${accepted.length === 1 ? "truck" : "trucks"}) and no specimen set is recorded. ` +
        "ACI 318 asks for strength samples at least once a day for each class of concrete; make cylinders from the next truck, or record why none are needed (the project specification or the building official).",
      applied: { value: 0, limit: 1, unit: "specimen sets" },
      source: { document: "ACI 318", edition: "19", clause: "§26.12.2.1", basis: "memory" },
      governs: GOVERNS,
    });
  }
  return findings;
}
