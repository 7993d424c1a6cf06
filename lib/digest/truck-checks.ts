// Warnings about the day's trucks: discharge time, drum revolutions and water added at the site.
import { ConcreteInputError, checkDischarge, checkWaterAddition, formatWaterVolume } from "@/lib/concrete";
import { placementName, truckName, type DigestWarning, type Lookup } from "./checks";
import type { DigestDay } from "./types";

// ASTM C94 §10.7 (limit from the project); drum revolutions only where the order states a limit.
export function dischargeWarnings(day: DigestDay, { placement }: Lookup): DigestWarning[] {
  const { dischargeLimitMinutes: limit, revolutionLimit } = day.project;
  const rule =
    limit === 90
      ? "ASTM C94 §10.7: discharge complete within 90 min of batching."
      : `Project specification: discharge complete within ${limit} min of batching (ASTM C94 default: 90 min).`;
  const warnings: DigestWarning[] = [];
  for (const d of day.deliveries) {
    if (!d.dischargeFinishedAt || d.status === "rejected") continue;
    let check;
    try {
      check = checkDischarge({
        batchedAt: d.batchedAt,
        dischargeFinishedAt: d.dischargeFinishedAt,
        limitMinutes: limit,
        revolutions: d.revolutions ?? undefined,
        revolutionLimit: revolutionLimit ?? undefined,
      });
    } catch (error) {
      if (error instanceof ConcreteInputError) continue; // inconsistent times are the office's review, not a warning
      throw error;
    }
    const where = placementName(placement(d.placementId));
    if (!check.withinTime) {
      warnings.push({
        tone: "danger",
        kind: "late-truck",
        title: `Late truck: ${truckName(d)}`,
        detail: `Discharge finished ${Math.round(check.minutes)} min after batching, over the ${limit} min limit (${where}).`,
        rule,
      });
    }
    if (check.withinRevolutions === false) {
      warnings.push({
        tone: "danger",
        kind: "revolutions",
        title: `Drum revolutions over the limit: ${truckName(d)}`,
        detail: `${d.revolutions} revolutions; the order allows ${revolutionLimit} (${where}).`,
        rule: "ASTM C94: revolution limit as stated in the order.",
      });
    }
  }
  return warnings;
}

// ASTM C94 (current wording): one site addition within the allowance, all of it within 15 min.
export function waterWarnings(day: DigestDay, { placement }: Lookup): DigestWarning[] {
  const units = day.project.unitSystem;
  return day.deliveries
    .filter((d) => (d.waterAddedL ?? 0) > 0)
    .map((d) => {
      const p = placement(d.placementId);
      const addedL = d.waterAddedL!;
      const allowedL = (p?.mix?.siteWaterAllowedLPerM3 ?? 0) * d.volumeM3;
      const window =
        d.waterFirstAt && d.waterLastAt
          ? checkWaterAddition({ firstAt: d.waterFirstAt, lastAt: d.waterLastAt, addedLitres: addedL, allowedLitres: allowedL })
          : null;
      const withinAllowance = addedL <= allowedL + 1e-9;
      const who = [d.waterAddedBy && `added by ${d.waterAddedBy}`, d.waterAuthorisedBy && `authorised by ${d.waterAuthorisedBy}`]
        .filter(Boolean)
        .join(", ");
      const verdict = withinAllowance
        ? `within the ${formatWaterVolume(allowedL, units)} the mix allows for this load`
        : `over the ${formatWaterVolume(allowedL, units)} the mix allows for this load`;
      const span = window && !window.withinWindow ? `; portions spread over ${Math.round(window.minutesSpan)} min` : "";
      return {
        tone: withinAllowance && (window?.withinWindow ?? true) ? "caution" : "danger",
        kind: "water",
        title: `Water added at site: ${truckName(d)}`,
        detail: `${formatWaterVolume(addedL, units)} ${who ? `${who}, ` : ""}${verdict}${span} (${placementName(p)}).`,
        rule: "ASTM C94: one site addition within the mix design's allowance, all within 15 min, then 30 revolutions.",
      } satisfies DigestWarning;
    });
}
