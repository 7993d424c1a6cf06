// What a truck ticket means under ASTM C94 and the project specification: discharge time, drum
// revolutions (only when the order states a limit) and water added at the site.
import { checkDischarge, checkWaterAddition, formatWaterVolume, toDisplay, unitLabel } from "@/lib/concrete";
import { GOVERNS, type CheckDelivery, type CheckMix, type CheckProject, type Finding, type Source } from "./types";

/** ASTM C94's default; a project may shorten it (hot weather) or the purchaser may waive it. */
const C94_DISCHARGE_MINUTES = 90;

const minutesBetween = (a: Date, b: Date) => (b.getTime() - a.getTime()) / 60_000;
export const ticketName = (d: Pick<CheckDelivery, "ticketNumber" | "truck">) => `ticket ${d.ticketNumber}${d.truck ? ` (truck ${d.truck})` : ""}`;

function dischargeSource(limitMinutes: number): Source {
  return limitMinutes === C94_DISCHARGE_MINUTES
    ? { document: "ASTM C94", clause: "§10.7", basis: "published" }
    : { document: "Project specification", basis: "project" };
}

/**
 * Discharge time. Finished: late or not. Not finished: the time elapsed against the limit as
 * information (no verdict until the discharge ends), when the caller knows the time now.
 */
export function dischargeFinding(d: CheckDelivery, project: CheckProject, now?: Date): Finding | null {
  if (d.status === "rejected") return null;
  const limit = project.dischargeLimitMinutes;
  const base = {
    subject: { type: "delivery" as const, id: d.id },
    placementId: d.placementId,
    source: dischargeSource(limit),
    governs: GOVERNS,
  };
  const limitText = limit === C94_DISCHARGE_MINUTES ? `${limit} min (ASTM C94)` : `${limit} min (project specification; ASTM C94 default ${C94_DISCHARGE_MINUTES} min)`;
  if (!d.dischargeFinishedAt) {
    if (!now) return null;
    const elapsed = Math.max(0, Math.floor(minutesBetween(d.batchedAt, now)));
    return {
      ...base,
      rule: "discharge-elapsed",
      severity: "info",
      at: now.toISOString(),
      title: `Discharging: ${elapsed} of ${limit} min since batching`,
      message:
        elapsed > limit
          ? `The ${limitText} limit has passed and the discharge is not finished. Only the purchaser can waive the limit, when the concrete can still be placed without adding water.`
          : `Discharge must be complete within ${limitText} of batching. Enter the time discharge ends to check it.`,
      applied: { value: elapsed, limit, unit: "min" },
    };
  }
  let check;
  try {
    check = checkDischarge({ batchedAt: d.batchedAt, dischargeFinishedAt: d.dischargeFinishedAt, limitMinutes: limit });
  } catch {
    return null; // times out of order are refused by the form and the schema; nothing to judge
  }
  if (check.withinTime) return null;
  const minutes = Math.round(check.minutes);
  return {
    ...base,
    rule: "discharge-time",
    severity: "warning",
    at: d.dischargeFinishedAt.toISOString(),
    title: `Late truck: ${ticketName(d)}, ${minutes} min from batching`,
    message:
      `Discharge finished ${minutes} min after batching, over the ${limitText} limit. ` +
      "The purchaser may accept the load only when it can still be placed without adding water; record who decided.",
    applied: { value: minutes, limit, unit: "min" },
  };
}

// ASTM C94-17a §6.1.9: a revolution limit applies only when the order states one.
export function revolutionsFinding(d: CheckDelivery, project: CheckProject): Finding | null {
  if (d.status === "rejected" || project.revolutionLimit === null || d.revolutions === null) return null;
  if (d.revolutions <= project.revolutionLimit) return null;
  return {
    rule: "revolutions",
    severity: "warning",
    subject: { type: "delivery", id: d.id },
    placementId: d.placementId,
    at: (d.dischargeFinishedAt ?? d.arrivedAt).toISOString(),
    title: `Drum revolutions over the limit: ${ticketName(d)}, ${d.revolutions} revolutions`,
    message: `${d.revolutions} revolutions; the order allows ${project.revolutionLimit}. ASTM C94 applies a revolution limit only when the order states one.`,
    applied: { value: d.revolutions, limit: project.revolutionLimit, unit: "revolutions" },
    source: { document: "ASTM C94", edition: "17a", clause: "§6.1.9", basis: "published" },
    governs: GOVERNS,
  };
}

// ASTM C94 (current wording): one addition within the mix's allowance, all portions within 15 min of the first.
export function siteWaterFinding(d: CheckDelivery, mix: CheckMix | null, project: CheckProject): Finding | null {
  const addedL = d.waterAddedL ?? 0;
  if (!(addedL > 0)) return null;
  const units = project.unitSystem;
  const allowedL = (mix?.siteWaterAllowedLPerM3 ?? 0) * d.volumeM3;
  const window = d.waterFirstAt && d.waterLastAt && d.waterLastAt >= d.waterFirstAt
    ? checkWaterAddition({ firstAt: d.waterFirstAt, lastAt: d.waterLastAt, addedLitres: addedL, allowedLitres: allowedL })
    : null;
  const withinAllowance = addedL <= allowedL + 1e-9;
  const withinWindow = window?.withinWindow ?? true;
  const problems = [
    withinAllowance ? null : `over the ${formatWaterVolume(allowedL, units)} the mix design allows for this load`,
    withinWindow ? null : `portions spread over ${Math.round(window!.minutesSpan)} min (all must be within 15 min of the first)`,
  ].filter(Boolean);
  return {
    rule: "site-water",
    severity: problems.length ? "warning" : "caution",
    subject: { type: "delivery", id: d.id },
    placementId: d.placementId,
    at: (d.waterLastAt ?? d.waterFirstAt ?? d.arrivedAt).toISOString(),
    title: problems.length
      ? `Water over the allowance or window: ${ticketName(d)}, ${formatWaterVolume(addedL, units)}`
      : `Water added at site: ${ticketName(d)}, ${formatWaterVolume(addedL, units)}`,
    message:
      (problems.length ? `Water added at site ${problems.join("; ")}. ` : `Within the ${formatWaterVolume(allowedL, units)} the mix design allows for this load. `) +
      "ASTM C94 allows one addition, all portions within 15 min of the first, then 30 drum revolutions at mixing speed, never beyond the mix design's maximum water.",
    applied: { value: toDisplay("waterVolume", addedL, units), limit: toDisplay("waterVolume", allowedL, units), unit: unitLabel("waterVolume", units) },
    source: { document: "ASTM C94", clause: "water added at the job site", basis: "published" },
    governs: GOVERNS,
  };
}

/** Mix codes compare without case, spaces or dashes: "LC 4000-A" on a ticket is the mix LC-4000-A. */
const sameMixCode = (a: string, b: string) => a.replace(/[\s-]/g, "").toUpperCase() === b.replace(/[\s-]/g, "").toUpperCase();

// ASTM C94 §14 (delivery ticket): the ticket names the concrete delivered; the inspector checks it is
// the mix ordered for this placement before it is placed [common practice].
export function mixCodeFinding(d: CheckDelivery, mix: CheckMix | null): Finding | null {
  if (d.status === "rejected" || !d.mixCode || !mix || sameMixCode(d.mixCode, mix.code)) return null;
  return {
    rule: "mix-code",
    severity: "warning",
    subject: { type: "delivery", id: d.id },
    placementId: d.placementId,
    at: d.arrivedAt.toISOString(),
    title: `Wrong mix on the ticket: ${ticketName(d)} says ${d.mixCode}, the placement's mix is ${mix.code}`,
    message:
      `The ticket names mix ${d.mixCode}; this placement was planned with ${mix.code}. Confirm with the supplier and the ` +
      "engineer of record before the load is placed; a load of the wrong mix is usually rejected.",
    applied: { value: null, limit: null, unit: "" },
    source: { document: "ASTM C94", clause: "§14 delivery ticket", basis: "practice" },
    governs: GOVERNS,
  };
}
