// In-place strength from temperature history: the maturity method (ASTM C1074).
import { ConcreteInputError, assertDate, assertFinite, assertPositive } from "./errors";

export interface TemperatureReading {
  at: Date;
  tempC: number;
}

const MS_PER_HOUR = 3_600_000;
const GAS_CONSTANT_J_PER_MOL_K = 8.314;
const KELVIN_OFFSET = 273.15;

// Each interval is represented by the mean of its two readings, so a logger's samples can be
// used as they come. Equal timestamps are allowed: they record a step change (a heater switched on).
function intervals(readings: TemperatureReading[]): { hours: number; meanC: number }[] {
  if (readings.length < 2) {
    throw new ConcreteInputError("readings", "At least two temperature readings are needed");
  }
  readings.forEach((reading, i) => {
    assertDate(reading.at, `readings[${i}].at`, "Reading time");
    assertFinite(reading.tempC, `readings[${i}].tempC`, "Temperature");
  });
  return readings.slice(1).map((reading, i) => {
    const previous = readings[i];
    const hours = (reading.at.getTime() - previous.at.getTime()) / MS_PER_HOUR;
    if (hours < 0) {
      throw new ConcreteInputError(`readings[${i + 1}].at`, "Temperature readings must be in time order");
    }
    return { hours, meanC: (previous.tempC + reading.tempC) / 2 };
  });
}

/** How the maturity index is computed (ASTM C1074); project settings with the standard's defaults. */
export type MaturityMethod = "nurse-saul" | "equivalent-age";
export interface MaturitySettings {
  method: MaturityMethod;
  /** Nurse-Saul datum temperature T0. */
  datumC: number;
  /** Equivalent age: apparent activation energy E (Q = E/R). */
  activationEnergyJPerMol: number;
  /** Equivalent age: reference temperature Ts. */
  referenceC: number;
}

// ASTM C1074 [memory]: T0 = 0 °C and Q = 5000 K (E ≈ 41.6 kJ/mol), Ts = 20 °C when not determined for the mix.
export const DEFAULT_MATURITY_SETTINGS: MaturitySettings = {
  method: "nurse-saul",
  datumC: 0,
  activationEnergyJPerMol: 41_570,
  referenceC: 20,
};

/** The unit of the maturity index a method gives. */
export function maturityUnit(method: MaturityMethod): string {
  return method === "nurse-saul" ? "°C·h" : "h";
}

// The index gained over one interval: C1074 Nurse-Saul (°C·h) or Arrhenius equivalent age (h at Ts).
function intervalGain(hours: number, meanC: number, settings: MaturitySettings): number {
  if (settings.method === "nurse-saul") return Math.max(0, meanC - settings.datumC) * hours;
  const qKelvin = settings.activationEnergyJPerMol / GAS_CONSTANT_J_PER_MOL_K;
  const meanK = meanC + KELVIN_OFFSET;
  if (meanK <= 0) throw new ConcreteInputError("readings", "Temperature readings are below absolute zero");
  return Math.exp(-qKelvin * (1 / meanK - 1 / (settings.referenceC + KELVIN_OFFSET))) * hours;
}

function assertSettings(settings: MaturitySettings): void {
  assertFinite(settings.datumC, "datumC", "Datum temperature");
  assertPositive(settings.activationEnergyJPerMol, "activationEnergyJPerMol", "Activation energy");
  assertFinite(settings.referenceC, "referenceC", "Reference temperature");
}

/** The maturity reached at each reading (0 at the first): the curve a chart draws and a target is read from. */
export function maturitySeries(
  readings: TemperatureReading[],
  settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS,
): { at: Date; tempC: number; maturity: number }[] {
  assertSettings(settings);
  const steps = intervals(readings);
  let sum = 0;
  const out = [{ at: readings[0].at, tempC: readings[0].tempC, maturity: 0 }];
  steps.forEach(({ hours, meanC }, i) => {
    sum += intervalGain(hours, meanC, settings);
    out.push({ at: readings[i + 1].at, tempC: readings[i + 1].tempC, maturity: sum });
  });
  return out;
}

/** The rate at which a constant temperature adds maturity, per hour (for a prediction "if it holds"). */
export function maturityRatePerHour(tempC: number, settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS): number {
  assertFinite(tempC, "tempC", "Temperature");
  assertSettings(settings);
  return intervalGain(1, tempC, settings);
}

const total = (readings: TemperatureReading[], settings: MaturitySettings) => {
  const series = maturitySeries(readings, settings);
  return series[series.length - 1].maturity;
};

// ASTM C1074 Nurse-Saul: M = Σ (Ta − T0)·Δt in °C·h; intervals below the datum add nothing.
export function temperatureTimeFactor(readings: TemperatureReading[], datumC = 0): number {
  return total(readings, { ...DEFAULT_MATURITY_SETTINGS, method: "nurse-saul", datumC });
}

// ASTM C1074 Arrhenius: te = Σ exp(−Q·(1/Ta − 1/Ts))·Δt, kelvin, Q = E/R (≈ 5000 K by default); hours.
export function equivalentAgeHours(
  readings: TemperatureReading[],
  {
    activationEnergyJPerMol = DEFAULT_MATURITY_SETTINGS.activationEnergyJPerMol,
    referenceC = DEFAULT_MATURITY_SETTINGS.referenceC,
  }: { activationEnergyJPerMol?: number; referenceC?: number } = {},
): number {
  return total(readings, { ...DEFAULT_MATURITY_SETTINGS, method: "equivalent-age", activationEnergyJPerMol, referenceC });
}

export interface StrengthMaturityFit {
  a: number;
  b: number;
  /** Calibration range: estimates outside it are extrapolations. */
  minMaturity: number;
  maxMaturity: number;
  /** Fit quality: coefficient of determination R² of S on log10(M) (1 = every point on the curve). */
  rSquared: number;
}

// ASTM C1074 appendix [memory]: least-squares fit of S = a + b·log10(M) to the lab calibration.
export function fitLogStrengthMaturity(points: { maturity: number; strength: number }[]): StrengthMaturityFit {
  if (points.length < 2) {
    throw new ConcreteInputError("points", "At least two calibration points are needed");
  }
  points.forEach((point, i) => {
    assertPositive(point.maturity, `points[${i}].maturity`, "Maturity");
    assertFinite(point.strength, `points[${i}].strength`, "Strength");
  });
  const xs = points.map((point) => Math.log10(point.maturity));
  const ys = points.map((point) => point.strength);
  const n = points.length;
  const meanX = xs.reduce((sum, x) => sum + x, 0) / n;
  const meanY = ys.reduce((sum, y) => sum + y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  xs.forEach((x, i) => {
    sxx += (x - meanX) ** 2;
    // Stryker disable next-line ArithmeticOperator: Σ(x ∓ x̄)(y − ȳ) and Σ(x − x̄)(y ∓ ȳ) are equal, since Σ(x − x̄) = Σ(y − ȳ) = 0.
    sxy += (x - meanX) * (ys[i] - meanY);
    syy += (ys[i] - meanY) ** 2;
  });
  if (sxx === 0) {
    throw new ConcreteInputError("points", "Calibration points need at least two different maturities");
  }
  const b = sxy / sxx;
  const maturities = points.map((point) => point.maturity);
  return {
    a: meanY - b * meanX,
    b,
    minMaturity: Math.min(...maturities),
    maxMaturity: Math.max(...maturities),
    // Simple linear regression: R² = Sxy² / (Sxx·Syy); equal strengths fit a flat line exactly.
    rSquared: syy === 0 ? 1 : (sxy * sxy) / (sxx * syy),
  };
}

// ASTM C1074: strength from the calibration curve; verify in place before stripping or stressing [memory].
export function estimateStrength(fit: Pick<StrengthMaturityFit, "a" | "b">, maturity: number): number {
  assertPositive(maturity, "maturity", "Maturity");
  // The logarithmic curve turns negative at very low maturity, where the real strength is just zero.
  return Math.max(0, fit.a + fit.b * Math.log10(maturity));
}
