// Display helpers for the lab screens (project units, project time zone).
import { formatStrength, mmToIn, type UnitSystem } from "@/lib/concrete";
import { formatInstant } from "@/lib/time/zone";

export const strengthText = (mpa: number | null | undefined, units: UnitSystem) =>
  mpa === null || mpa === undefined ? "—" : formatStrength(mpa, units);

export const cylinderText = (diameterMm: number, lengthMm: number | null, units: UnitSystem) => {
  if (units === "SI") return `${Math.round(diameterMm)} × ${lengthMm ? Math.round(lengthMm) : "?"} mm`;
  return `${Number(mmToIn(diameterMm).toFixed(1))} × ${lengthMm ? Number(mmToIn(lengthMm).toFixed(1)) : "?"} in`;
};

export function dateTimeText(iso: string | Date, timeZone: string) {
  return formatInstant(iso, timeZone, "dayTime");
}

export function dateText(iso: string | Date, timeZone: string) {
  return formatInstant(iso, timeZone, "weekdayDate");
}

/** A set's nominal cylinder class: 100 or 150 mm, moulded as 4 × 8 or 6 × 12 in on inch-pound jobs. */
export const nominalCylinderText = (diameterMm: number, lengthMm: number, units: UnitSystem) =>
  units === "SI" ? `${diameterMm} × ${Math.round(lengthMm)} mm` : diameterMm >= 150 ? "6 × 12 in" : `4 × ${Number(mmToIn(lengthMm).toFixed(1))} in`;

/** "today", "in 5 d", "3 d ago" from now to a due time. */
export function relativeDays(iso: string, now = Date.now()) {
  const days = Math.round((Date.parse(iso) - now) / 86_400_000);
  return days === 0 ? "today" : days > 0 ? `in ${days} d` : `${-days} d ago`;
}
