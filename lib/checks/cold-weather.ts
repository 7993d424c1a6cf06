// Cold weather and protection: whether a project-local day is cold weather under the project's chosen
// definition (ACI 306R current, or ACI 306.1-90), and whether a protection or curing reading is below
// the minimum for the section (ACI 306R). Compared in the project's units with that system's values.
import {
  COLD_WEATHER_LIMITS,
  FREEZE_PROTECTION_STRENGTH,
  formatTemperature,
  hoursAbove,
  isColdWeather,
  minimumConcreteTemp,
  minimumConcreteTempC,
  temperatureInUnits,
  type UnitSystem,
} from "@/lib/concrete";
import { addDays, localDate } from "@/lib/time/zone";
import { GOVERNS, type CheckCuring, type CheckInput, type CheckPlacement, type CheckProject, type CheckWeather, type Finding } from "./types";

/** The cautions that go with cold-weather work: heaters can kill, and fresh concrete must not freeze. */
export function coldWeatherCautions(unitSystem: UnitSystem): string[] {
  const freeze = FREEZE_PROTECTION_STRENGTH[unitSystem];
  return [
    "Vent combustion heaters in enclosures to the outside: their exhaust carries carbon monoxide.",
    `Protect the fresh concrete from freezing until it reaches about ${freeze.value} ${freeze.unit} (PCA, Design and Control of Concrete Mixtures).`,
    "Do not place concrete on frozen ground or against ice on forms or reinforcement.",
  ];
}

const unitOf = (unitSystem: UnitSystem) => (unitSystem === "SI" ? "°C" : "°F");

type DayStats = { date: string; meanC: number; warmHours: number; lowest: CheckWeather };

// Average daily temperature as the mean of the day's high and low (ACI 306.1-90 usage).
function dayStats(readings: CheckWeather[], timeZone: string, unitSystem: UnitSystem): Map<string, DayStats> {
  const byDate = new Map<string, CheckWeather[]>();
  for (const r of readings) {
    const date = localDate(r.observedAt, timeZone);
    byDate.set(date, [...(byDate.get(date) ?? []), r]);
  }
  // Stryker disable next-line ConditionalExpression,EqualityOperator,StringLiteral: 10 °C and 50 °F are the same temperature, so either branch gives 10 °C.
  const warmC = unitSystem === "SI" ? COLD_WEATHER_LIMITS["aci306-1990"].SI.warm : ((COLD_WEATHER_LIMITS["aci306-1990"].IP.warm - 32) * 5) / 9;
  const stats = new Map<string, DayStats>();
  for (const [date, day] of byDate) {
    const temps = day.map((r) => r.airTempC);
    const lowest = day.reduce((a, b) => (b.airTempC < a.airTempC ? b : a));
    const warmHours = hoursAbove(day.map((r) => ({ at: r.observedAt, tempC: r.airTempC })), warmC);
    stats.set(date, { date, meanC: (Math.max(...temps) + Math.min(...temps)) / 2, warmHours, lowest });
  }
  return stats;
}

/** The least section dimension the minimum-temperature table can be read for: known and positive, else null. */
const sectionMm = (p: Pick<CheckPlacement, "leastDimensionMm"> | undefined): number | null =>
  (p?.leastDimensionMm ?? 0) > 0 ? p!.leastDimensionMm : null;

function minimumsText(placements: CheckPlacement[], unitSystem: UnitSystem): string {
  const list = placements
    .filter((p) => sectionMm(p) !== null)
    .map((p) => `${p.element} at or above ${minimumConcreteTemp(sectionMm(p)!, unitSystem)} ${unitOf(unitSystem)}`);
  return list.length ? ` Keep ${list.join("; ")} (ACI 306R minimum by least section dimension).` : "";
}

/** One finding per project-local day of the readings that is cold weather under the project's definition. */
export function coldWeatherFindings(input: Pick<CheckInput, "project" | "weather" | "placements">): Finding[] {
  const { project } = input;
  const units = project.unitSystem;
  const stats = dayStats(input.weather, project.timeZone, units);
  const findings: Finding[] = [];
  for (const day of stats.values()) {
    let result;
    if (project.coldWeatherDefinition === "aci306-1990") {
      // The run of days that ends on this one, as far back as readings go (4 days decide it).
      const run: DayStats[] = [];
      for (let d = day.date, s = stats.get(d); s && run.length < 4; d = addDays(d, -1), s = stats.get(d)) run.unshift(s);
      result = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: run.map((s) => s.meanC), dailyWarmHours: run.map((s) => s.warmHours), unitSystem: units });
    } else {
      result = isColdWeather({ definition: "aci306r-current", observedAirTempsC: [day.lowest.airTempC], unitSystem: units });
    }
    if (!result.cold) continue;
    const placements = input.placements.filter((p) => localDate(p.plannedStart, project.timeZone) === day.date);
    const definition =
      project.coldWeatherDefinition === "aci306-1990"
        ? `ACI 306.1-90: cold weather when the average daily temperature is below ${result.limit} ${unitOf(units)} for more than 3 successive days`
        : `ACI 306R: cold weather when the air has fallen to, or is expected to fall below, ${result.limit} ${unitOf(units)}`;
    findings.push({
      rule: "cold-weather",
      severity: "caution",
      subject: { type: "day", id: day.date },
      placementId: null,
      at: day.lowest.observedAt.toISOString(),
      title: `Cold weather: protect the fresh concrete (air down to ${formatTemperature(day.lowest.airTempC, units)})`,
      message: `${result.reason}. ${definition}.${minimumsText(placements, units)} ${coldWeatherCautions(units).join(" ")}`,
      applied: { value: temperatureInUnits(project.coldWeatherDefinition === "aci306-1990" ? day.meanC : day.lowest.airTempC, units), limit: result.limit, unit: unitOf(units) },
      source:
        project.coldWeatherDefinition === "aci306-1990"
          ? { document: "ACI 306.1", edition: "90", basis: units === "SI" ? "memory" : "published" }
          : { document: "ACI 306R", basis: "published" },
      governs: GOVERNS,
    });
  }
  return findings;
}

/** A protection or curing reading below the minimum for the placement's least section dimension. */
export function curingFinding(reading: CheckCuring, placement: CheckPlacement | undefined, project: CheckProject): Finding | null {
  const sizeMm = sectionMm(placement);
  if (sizeMm === null) return null;
  const units = project.unitSystem;
  const minimum = minimumConcreteTemp(sizeMm, units);
  const value = temperatureInUnits(reading.tempC, units);
  if (value >= minimum) return null;
  const unit = unitOf(units);
  return {
    rule: "curing-temperature",
    severity: "warning",
    subject: { type: "curing", id: reading.id },
    placementId: placement!.id,
    at: reading.readAt.toISOString(),
    title: `Below the minimum for this section: ${formatTemperature(reading.tempC, units)} (minimum ${minimum} ${unit})`,
    message:
      `ACI 306R: keep concrete with this least dimension at or above ${minimum} ${unit} while it is protected. ` +
      `Raise the heat or the insulation and read again. ${coldWeatherCautions(units).slice(0, 2).join(" ")}`,
    applied: { value, limit: minimum, unit },
    source: { document: "ACI 306R", clause: "minimum temperature by least section dimension (ACI 306.1 Table 3.1)", basis: "published" },
    governs: GOVERNS,
  };
}

/** The minimum the curing log shows for a placement, in °C as stored (for input hints). */
export const curingMinimumC = (placement: Pick<CheckPlacement, "leastDimensionMm">, unitSystem: UnitSystem): number | null => {
  const sizeMm = sectionMm(placement);
  return sizeMm === null ? null : minimumConcreteTempC(sizeMm, unitSystem);
};
