// Vapour pressure and dew point: ASHRAE Handbook Fundamentals 2017 ch. 1 eqns 5 and 6
// (Hyland–Wexler), written out here so the browser does not load a psychrometrics library for
// one formula. PsychroLib (npm) implements the same equations and is the reference the unit tests
// compare against (tests/unit/concrete/psychro*.test.ts); it is not part of the app.
import { assertRange } from "./errors";

type Coefficients = readonly [number, number, number, number, number, number, number];

// ln(pws) = c0/T + c1 + c2·T + c3·T² + c4·T³ + c5·T⁴ + c6·ln T
// SI: T in K, pws in Pa. Over ice (eqn 5) at or below the triple point, over water (eqn 6) above.
const SI_ICE: Coefficients = [-5.6745359e3, 6.3925247, -9.677843e-3, 6.2215701e-7, 2.0747825e-9, -9.484024e-13, 4.1635019];
const SI_WATER: Coefficients = [-5.8002206e3, 1.3914993, -4.8640239e-2, 4.1764768e-5, -1.4452093e-8, 0, 6.5459673];
// IP: T in °R, pws in psi.
const IP_ICE: Coefficients = [-1.0214165e4, -4.8932428, -5.3765794e-3, 1.9202377e-7, 3.5575832e-10, -9.0344688e-14, 4.1635019];
const IP_WATER: Coefficients = [-1.0440397e4, -1.129465e1, -2.7022355e-2, 1.289036e-5, -2.4780681e-9, 0, 6.5459673];

const TRIPLE_POINT_C = 0.01;
const TRIPLE_POINT_F = 32.018;

function lnPws(c: Coefficients, t: number): number {
  return c[0] / t + c[1] + c[2] * t + c[3] * t ** 2 + c[4] * t ** 3 + c[5] * t ** 4 + c[6] * Math.log(t);
}

/** d ln(pws) / dT, for the Newton steps of the dew point. */
function dLnPws(c: Coefficients, t: number): number {
  return -c[0] / t ** 2 + c[2] + 2 * c[3] * t + 3 * c[4] * t ** 2 + 4 * c[5] * t ** 3 + c[6] / t;
}

const siCoefficients = (tempC: number) => (tempC <= TRIPLE_POINT_C ? SI_ICE : SI_WATER);

// ASHRAE 2017 ch. 1 eqn 5/6: saturation vapour pressure in Pa over water (ice below 0.01 °C).
export function saturationVapourPressurePa(tempC: number): number {
  assertRange(tempC, "tempC", "Temperature", -100, 200, "°C");
  return Math.exp(lnPws(siCoefficients(tempC), tempC + 273.15));
}

// ASHRAE 2017 ch. 1 eqn 5/6, inch-pound form: saturation vapour pressure in psi.
export function saturationVapourPressurePsi(tempF: number): number {
  assertRange(tempF, "tempF", "Temperature", -148, 392, "°F");
  return Math.exp(lnPws(tempF <= TRIPLE_POINT_F ? IP_ICE : IP_WATER, tempF + 459.67));
}

// ASHRAE 2017 ch. 1 (inverse of eqn 5/6): dew point of air at tempC and relative humidity,
// by Newton's method on ln(pws) from the air temperature, to 0.001 °C.
export function dewPointC(tempC: number, relativeHumidityPct: number): number {
  assertRange(tempC, "tempC", "Temperature", -100, 200, "°C");
  // At 0 % RH there is no vapour and so no dew point (log(0)).
  assertRange(relativeHumidityPct, "relativeHumidityPct", "Relative humidity", 0, 100, "%");
  if (relativeHumidityPct === 0) return Number.NEGATIVE_INFINITY;
  const target = Math.log((relativeHumidityPct / 100) * saturationVapourPressurePa(tempC));
  let dewC = tempC;
  // Stryker disable next-line EqualityOperator,UpdateOperator: a safety cap never reached; Newton converges in a few steps over −100…200 °C, so the loop always returns from inside.
  for (let i = 0; i < 100; i++) {
    const c = siCoefficients(dewC);
    const next = Math.min(200, Math.max(-100, dewC - (lnPws(c, dewC + 273.15) - target) / dLnPws(c, dewC + 273.15)));
    // Stryker disable next-line EqualityOperator,ConditionalExpression: an early stop only; without it the capped loop returns the same root (quadratic convergence: a step under 0.001 °C leaves an error near 1e-9 °C).
    if (Math.abs(next - dewC) <= 0.001) return next;
    dewC = next;
  }
  return dewC;
}
