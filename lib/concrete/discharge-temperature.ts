// Concrete temperature at discharge: the ACI 305.1 / ACI 301 maximum, and the ACI 306R minimum for the
// section in cold weather (./cold-weather.ts).
import { assertFinite } from "./errors";
import { minimumConcreteTempC } from "./cold-weather";
import { formatTemperature, type UnitSystem } from "./units";

export interface DischargeTempCheck {
  ok: boolean;
  tooHot: boolean;
  tooCold: boolean;
  /** The limit the verdict refers to: the minimum when too cold, otherwise the maximum. */
  limitC: number;
  maxC: number;
  minC?: number;
  message: string;
}

// ACI 305.1-14 §3.3.1 / ACI 301: 35 °C (95 °F) maximum at discharge; minimum from ACI 306 by section.
export function checkConcreteTempAtDischarge({
  concreteTempC,
  maxC = 35,
  minC,
  leastDimensionMm,
  unitSystem = "SI",
}: {
  concreteTempC: number;
  maxC?: number;
  /** Pass in cold weather only; otherwise taken from leastDimensionMm when that is given. */
  minC?: number;
  leastDimensionMm?: number;
  unitSystem?: UnitSystem;
}): DischargeTempCheck {
  assertFinite(concreteTempC, "concreteTempC", "Concrete temperature");
  assertFinite(maxC, "maxC", "Maximum concrete temperature");
  const minimumC =
    minC ?? (leastDimensionMm !== undefined ? minimumConcreteTempC(leastDimensionMm, unitSystem) : undefined);
  if (minimumC !== undefined) assertFinite(minimumC, "minC", "Minimum concrete temperature");
  const tooHot = concreteTempC > maxC;
  const tooCold = concreteTempC < (minimumC ?? Number.NEGATIVE_INFINITY);
  const show = (tempC: number) => formatTemperature(tempC, unitSystem, 1);
  const limitC = tooCold ? (minimumC ?? maxC) : maxC;
  let message: string;
  if (tooHot) message = `Concrete at ${show(concreteTempC)} is above the ${show(maxC)} maximum at discharge`;
  else if (tooCold) message = `Concrete at ${show(concreteTempC)} is below the ${show(limitC)} minimum for this section`;
  else message = `Concrete at ${show(concreteTempC)} is within the temperature limits`;
  return {
    ok: !tooHot && !tooCold,
    tooHot,
    tooCold,
    limitC,
    maxC,
    ...(minimumC !== undefined ? { minC: minimumC } : {}),
    message,
  };
}
