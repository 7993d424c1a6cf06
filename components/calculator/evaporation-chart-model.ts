// The evaporation calculator's chart: the rate at each wind speed for the readings typed, and the
// same chart in words. Pure, like evaporation-model.ts beside it.
import { evaporationRateIP, evaporationRateSI, unitLabel, type UnitSystem } from "@/lib/concrete";
import { formatRate, riskThresholds, type Readings } from "./evaporation-model";

// Nomograph range of the published chart: about 0–40 km/h (25 mph).
export const CHART_WIND_MAX: Record<UnitSystem, number> = { SI: 40, IP: 25 };

export interface ChartPoint {
  wind: number;
  rate: number;
}

/** Uno's rate at each whole wind speed for today's temperatures and humidity. */
export function rateByWind(readings: Readings, unitSystem: UnitSystem): ChartPoint[] {
  const top = Math.max(CHART_WIND_MAX[unitSystem], Math.ceil(readings.wind / 5) * 5);
  const step = top > 60 ? 5 : 1;
  const points: ChartPoint[] = [];
  for (let wind = 0; wind <= top; wind += step) {
    const rate =
      unitSystem === "SI"
        ? evaporationRateSI({
            airTempC: readings.airTemp,
            relativeHumidityPct: readings.humidity,
            windKmh: wind,
            concreteTempC: readings.concreteTemp,
          })
        : evaporationRateIP({
            airTempF: readings.airTemp,
            relativeHumidityPct: readings.humidity,
            windMph: wind,
            concreteTempF: readings.concreteTemp,
          });
    points.push({ wind, rate });
  }
  return points;
}

/** The first charted wind speed at which the rate reaches a level, or null within the chart. */
export function windToReach(points: ChartPoint[], level: number): number | null {
  return points.find((p) => p.rate >= level)?.wind ?? null;
}

// The chart in words, for screen readers and for anyone who cannot read the lines.
export function chartSummary(points: ChartPoint[], unitSystem: UnitSystem, lowBleed: boolean): string {
  const rateUnit = unitLabel("evaporationRate", unitSystem);
  const speedUnit = unitLabel("speed", unitSystem);
  const first = points[0];
  const last = points[points.length - 1];
  const { cautionAt, highAt } = riskThresholds(unitSystem, lowBleed);
  const reach = (level: number, name: string) => {
    const wind = windToReach(points, level);
    if (wind === null) return `It stays below the ${name} level (${formatRate(level)}) up to ${last.wind} ${speedUnit}.`;
    if (wind === 0) return `It is at or above the ${name} level (${formatRate(level)}) even in still air.`;
    return `It reaches the ${name} level (${formatRate(level)}) at about ${wind} ${speedUnit}.`;
  };
  if (last.rate === 0) {
    return `For these temperatures and humidity there is no evaporation at any wind speed up to ${last.wind} ${speedUnit}.`;
  }
  return [
    `For these temperatures and humidity the rate rises from ${formatRate(first.rate)} ${rateUnit} in still air`,
    `to ${formatRate(last.rate)} ${rateUnit} at ${last.wind} ${speedUnit}.`,
    reach(cautionAt, "caution"),
    reach(highAt, "high"),
  ].join(" ");
}
