// Warnings about the day's weather: evaporation (plastic-shrinkage risk) and cold weather.
import {
  evaporationRisk,
  formatEvaporation,
  formatSpeed,
  formatTemperature,
  isColdWeather,
  kgM2hToLbFt2h,
  minimumConcreteTempC,
  unitLabel,
} from "@/lib/concrete";
import { GOVERNS, placementName, type DigestWarning, type Lookup } from "./checks";
import type { DigestDay } from "./types";

// ACI 305R Fig. 2.1.5 thresholds (halved for low-bleed mixes), or the project specification's own.
export function evaporationWarnings(day: DigestDay, { placement, time }: Lookup): DigestWarning[] {
  const units = day.project.unitSystem;
  const unit = unitLabel("evaporationRate", units);
  const override = day.project.evaporationHighKgM2H;
  const groups = new Map<string, { total: number; high: DigestDay["weather"] }>();
  let lowBleedSeen = false;
  for (const w of day.weather) {
    if (w.evaporationKgM2H === null) continue;
    const lowBleed = placement(w.placementId)?.mix?.lowBleed ?? false;
    const rate = units === "SI" ? w.evaporationKgM2H : kgM2hToLbFt2h(w.evaporationKgM2H);
    const highAt = override === null ? undefined : units === "SI" ? override : kgM2hToLbFt2h(override);
    const risk = evaporationRisk(rate, units, highAt === undefined ? { lowBleed } : { highAt, cautionAt: highAt / 2 });
    const key = w.placementId ?? "site";
    const group = groups.get(key) ?? { total: 0, high: [] };
    group.total += 1;
    if (risk === "high") {
      group.high.push(w);
      lowBleedSeen ||= lowBleed && override === null;
    }
    groups.set(key, group);
  }
  const published = units === "SI" ? 1.0 : 0.2;
  const threshold =
    override !== null
      ? `Project specification: precautions above ${formatEvaporation(override, units)} (ACI 305R default ${published.toFixed(1)} ${unit}).`
      : `ACI 305R: precautions against plastic-shrinkage cracking when evaporation exceeds ${published.toFixed(1)} ${unit}${lowBleedSeen ? `, ${(published / 2).toFixed(1)} ${unit} for a low-bleed mix` : ""}.`;
  return [...groups.entries()]
    .filter(([, g]) => g.high.length > 0)
    .map(([key, g]) => {
      const peak = g.high.reduce((a, b) => (b.evaporationKgM2H! > a.evaporationKgM2H! ? b : a));
      const where = key === "site" ? "site reading" : placementName(placement(key));
      return {
        tone: "danger" as const,
        kind: "evaporation" as const,
        title: `High evaporation: ${formatEvaporation(peak.evaporationKgM2H!, units)} at ${time(peak.observedAt)} (${where})`,
        detail:
          `${g.high.length} of ${g.total} readings at high risk of plastic-shrinkage cracking. At the peak: air ${formatTemperature(peak.airTempC, units)}, ` +
          `humidity ${Math.round(peak.relativeHumidityPct)} %, wind ${formatSpeed(peak.windKmh, units)}` +
          `${peak.concreteTempC !== null ? `, concrete ${formatTemperature(peak.concreteTempC, units)}` : ""}.`,
        rule: `${threshold} ${GOVERNS}`,
      };
    });
}

// ACI 306R (current definition) or ACI 306.1-90, as the project chose; minimum temperatures by section (ACI 306R).
export function coldWarnings(day: DigestDay): DigestWarning[] {
  const units = day.project.unitSystem;
  const limit = units === "SI" ? "4 °C" : "40 °F";
  let result;
  if (day.project.coldWeatherDefinition === "aci306-1990") {
    if (day.dailyMeanAirTempsC.length === 0) return [];
    result = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: day.dailyMeanAirTempsC, unitSystem: units });
  } else {
    if (day.weather.length === 0) return [];
    result = isColdWeather({ definition: "aci306r-current", observedAirTempsC: day.weather.map((w) => w.airTempC), unitSystem: units });
  }
  if (!result.cold) return [];
  const minimums = day.placements
    .filter((p) => p.leastDimensionMm !== null && p.leastDimensionMm > 0)
    .map((p) => `${p.element} at or above ${formatTemperature(minimumConcreteTempC(p.leastDimensionMm!, units), units)}`);
  const rule =
    day.project.coldWeatherDefinition === "aci306-1990"
      ? `ACI 306.1-90: cold weather when the average daily temperature is below ${limit} for more than 3 successive days`
      : `ACI 306R: cold weather when the air temperature has fallen to, or is expected to fall below, ${limit}`;
  return [
    {
      tone: "caution",
      kind: "cold",
      title: "Cold weather: protect the fresh concrete",
      detail: `${result.reason}.${minimums.length ? ` Keep ${minimums.join("; ")} (ACI 306R minimum by section size).` : ""}`,
      rule: `${rule}. ${GOVERNS}`,
    },
  ];
}
