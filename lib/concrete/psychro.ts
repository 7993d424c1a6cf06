// Vapour pressure and dew point from PsychroLib (ASHRAE Handbook Fundamentals 2017 ch. 1).
import psychrolib from "psychrolib";

import { assertRange } from "./errors";

type PsychroUnits = typeof psychrolib.IP | typeof psychrolib.SI;

// PsychroLib keeps its unit system in module-global state that other code may also set.
// Calls are synchronous, so switching, computing and restoring cannot interleave with anyone.
function withUnits<T>(units: PsychroUnits, compute: () => T): T {
  const previous = psychrolib.GetUnitSystem();
  psychrolib.SetUnitSystem(units);
  try {
    return compute();
  } finally {
    if (previous !== undefined) psychrolib.SetUnitSystem(previous);
  }
}

// ASHRAE 2017 ch. 1 eqn 5/6: saturation vapour pressure in Pa over water (ice below 0.01 °C).
export function saturationVapourPressurePa(tempC: number): number {
  assertRange(tempC, "tempC", "Temperature", -100, 200, "°C");
  return withUnits(psychrolib.SI, () => psychrolib.GetSatVapPres(tempC));
}

// ASHRAE 2017 ch. 1 eqn 5/6, inch-pound form: saturation vapour pressure in psi.
export function saturationVapourPressurePsi(tempF: number): number {
  assertRange(tempF, "tempF", "Temperature", -148, 392, "°F");
  return withUnits(psychrolib.IP, () => psychrolib.GetSatVapPres(tempF));
}

// ASHRAE 2017 ch. 1 (inverse of eqn 5/6): dew point of air at tempC and relative humidity.
export function dewPointC(tempC: number, relativeHumidityPct: number): number {
  assertRange(tempC, "tempC", "Temperature", -100, 200, "°C");
  // At 0 % RH there is no vapour and so no dew point; PsychroLib would fail on log(0).
  assertRange(relativeHumidityPct, "relativeHumidityPct", "Relative humidity", 0, 100, "%");
  if (relativeHumidityPct === 0) return Number.NEGATIVE_INFINITY;
  return withUnits(psychrolib.SI, () =>
    psychrolib.GetTDewPointFromRelHum(tempC, relativeHumidityPct / 100),
  );
}
