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

// ASTM C1074 Nurse-Saul: M = Σ (Ta − T0)·Δt in °C·h; intervals below the datum add nothing.
export function temperatureTimeFactor(readings: TemperatureReading[], datumC = 0): number {
  assertFinite(datumC, "datumC", "Datum temperature");
  return intervals(readings).reduce(
    (sum, { hours, meanC }) => sum + Math.max(0, meanC - datumC) * hours,
    0,
  );
}

// ASTM C1074 Arrhenius: te = Σ exp(−Q·(1/Ta − 1/Ts))·Δt, kelvin, Q = E/R (≈ 5000 K by default); hours.
export function equivalentAgeHours(
  readings: TemperatureReading[],
  {
    activationEnergyJPerMol = 41_570,
    referenceC = 20,
  }: { activationEnergyJPerMol?: number; referenceC?: number } = {},
): number {
  assertPositive(activationEnergyJPerMol, "activationEnergyJPerMol", "Activation energy");
  assertFinite(referenceC, "referenceC", "Reference temperature");
  const qKelvin = activationEnergyJPerMol / GAS_CONSTANT_J_PER_MOL_K;
  const referenceK = referenceC + KELVIN_OFFSET;
  return intervals(readings).reduce((sum, { hours, meanC }) => {
    const meanK = meanC + KELVIN_OFFSET;
    if (meanK <= 0) throw new ConcreteInputError("readings", "Temperature readings are below absolute zero");
    return sum + Math.exp(-qKelvin * (1 / meanK - 1 / referenceK)) * hours;
  }, 0);
}

export interface StrengthMaturityFit {
  a: number;
  b: number;
  /** Calibration range: estimates outside it are extrapolations. */
  minMaturity: number;
  maxMaturity: number;
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
  xs.forEach((x, i) => {
    sxx += (x - meanX) ** 2;
    sxy += (x - meanX) * (ys[i] - meanY);
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
  };
}

// ASTM C1074: strength from the calibration curve; verify in place before stripping or stressing [memory].
export function estimateStrength(fit: Pick<StrengthMaturityFit, "a" | "b">, maturity: number): number {
  assertPositive(maturity, "maturity", "Maturity");
  // The logarithmic curve turns negative at very low maturity, where the real strength is just zero.
  return Math.max(0, fit.a + fit.b * Math.log10(maturity));
}
