// Display helpers for the lab screens (project units, project time zone).
import { formatStrength, mmToIn, type UnitSystem } from "@/lib/concrete";

export const strengthText = (mpa: number | null | undefined, units: UnitSystem) =>
  mpa === null || mpa === undefined ? "—" : formatStrength(mpa, units);

export const cylinderText = (diameterMm: number, lengthMm: number | null, units: UnitSystem) => {
  if (units === "SI") return `${Math.round(diameterMm)} × ${lengthMm ? Math.round(lengthMm) : "?"} mm`;
  return `${Number(mmToIn(diameterMm).toFixed(1))} × ${lengthMm ? Number(mmToIn(lengthMm).toFixed(1)) : "?"} in`;
};

export function dateTimeText(iso: string | Date, timeZone: string) {
  return new Intl.DateTimeFormat("en-US", { timeZone, month: "short", day: "numeric", hour: "numeric", minute: "2-digit" }).format(new Date(iso));
}

export function dateText(iso: string | Date, timeZone: string) {
  return new Intl.DateTimeFormat("en-US", { timeZone, weekday: "short", month: "short", day: "numeric", year: "numeric" }).format(new Date(iso));
}
