// Compressive strength: specimen results (ASTM C39), tests and acceptance (ACI 318-19 §26.12).
import { ConcreteInputError, assertFinite, assertNonNegative, assertPositive, atLeast } from "./errors";
import { m2ToFt2, m3ToYd3, type UnitSystem } from "./units";

export const STRUCTURAL_ADEQUACY_NOTE =
  "These checks compare test results with the specified limits; whether the structure is adequate " +
  "is the engineer of record's decision.";

// ASTM C39 / C42 correction table for short specimens [memory: ASTM C39/C39M table].
const LD_TABLE: [number, number][] = [
  [1.0, 0.87],
  [1.25, 0.93],
  [1.5, 0.96],
  [1.75, 0.98],
];

// ASTM C39: strength correction for length/diameter ≤ 1.75, interpolated; 1 above 1.75 [memory].
export function lengthDiameterFactor(ratio: number): number {
  assertFinite(ratio, "lengthMm", "Length/diameter ratio");
  if (ratio > 1.75) return 1;
  if (ratio < 1) {
    throw new ConcreteInputError("lengthMm", "Specimens shorter than their diameter cannot be corrected (L/D below 1.0)");
  }
  // Stryker disable next-line EqualityOperator: equivalent, the last row (1.75) always returns inside the loop
  for (let i = 1; i < LD_TABLE.length; i++) {
    const [r0, f0] = LD_TABLE[i - 1];
    const [r1, f1] = LD_TABLE[i];
    // Stryker disable next-line EqualityOperator: equivalent, at a row's own L/D both neighbouring segments give its factor
    if (ratio <= r1) return f0 + ((ratio - r0) / (r1 - r0)) * (f1 - f0);
  }
  // Stryker disable next-line ArithmeticOperator: unreachable, every ratio from 1.0 to 1.75 returns inside the loop
  return LD_TABLE[LD_TABLE.length - 1][1];
}

// ASTM C39: f = Pmax / (π d² / 4), corrected for L/D ≤ 1.75 when the length is given; MPa.
export function cylinderStrengthMPa({
  maxLoadKN,
  diameterMm,
  lengthMm,
}: {
  maxLoadKN: number;
  diameterMm: number;
  lengthMm?: number;
}): number {
  assertPositive(maxLoadKN, "maxLoadKN", "Maximum load");
  assertPositive(diameterMm, "diameterMm", "Diameter");
  const areaMm2 = (Math.PI * diameterMm * diameterMm) / 4;
  const strengthMPa = (maxLoadKN * 1000) / areaMm2;
  if (lengthMm === undefined) return strengthMPa;
  assertPositive(lengthMm, "lengthMm", "Length");
  return strengthMPa * lengthDiameterFactor(lengthMm / diameterMm);
}

// ACI 318 / 301: a strength test averages ≥ 2 cylinders of 150 × 300 mm or ≥ 3 of 100 × 200 mm.
export function strengthTest(
  cylinderStrengths: number[],
  { diameterMm = 150 }: { diameterMm?: number } = {},
): number {
  assertPositive(diameterMm, "diameterMm", "Cylinder diameter");
  // 6 in (152.4 mm) counts as the large size; anything smaller needs three, as 100 mm does.
  const needed = diameterMm >= 150 ? 2 : 3;
  if (cylinderStrengths.length < needed) {
    throw new ConcreteInputError(
      "cylinderStrengths",
      `A strength test needs at least ${needed} cylinders of this size`,
    );
  }
  cylinderStrengths.forEach((value, i) => assertPositive(value, `cylinderStrengths[${i}]`, "Cylinder strength"));
  return cylinderStrengths.reduce((sum, value) => sum + value, 0) / cylinderStrengths.length;
}

export interface AcceptanceTest {
  value: number;
  lowIndividual: boolean;
  /** Average of this test and the two before it; undefined for the first two tests. */
  runningAverage?: number;
  lowAverage?: boolean;
}

export interface AcceptanceResult {
  ok: boolean;
  individualLimit: number;
  /** False until three tests exist: criterion (a) cannot be judged before then. */
  averageJudged: boolean;
  tests: AcceptanceTest[];
}

// Published limits per unit system (3.5 MPa is not an exact conversion of 500 psi).
function individualLimit(fc: number, unitSystem: UnitSystem): number {
  const [threshold, margin] = unitSystem === "SI" ? [35, 3.5] : [5000, 500];
  // Stryker disable next-line EqualityOperator: equivalent, at 35 MPa (5000 psi) both rules give 31.5 MPa (4500 psi)
  return fc <= threshold ? fc - margin : (fc * 9) / 10;
}

// ACI 318-19 §26.12.3.1: averages of 3 consecutive tests ≥ f'c; no test below f'c − 3.5 MPa (500 psi) or 0.90 f'c.
export function evaluateAcceptance({
  fc,
  tests,
  unitSystem,
}: {
  /** Specified strength: MPa for SI, psi for IP, same unit as the tests. */
  fc: number;
  tests: number[];
  unitSystem: UnitSystem;
}): AcceptanceResult {
  assertPositive(fc, "fc", "Specified strength f'c");
  if (tests.length === 0) throw new ConcreteInputError("tests", "Enter at least one strength test");
  tests.forEach((value, i) => assertNonNegative(value, `tests[${i}]`, "Strength test"));
  const limit = individualLimit(fc, unitSystem);
  const evaluated = tests.map((value, i): AcceptanceTest => {
    const test: AcceptanceTest = { value, lowIndividual: !atLeast(value, limit) };
    if (i >= 2) {
      const runningAverage = (tests[i - 2] + tests[i - 1] + value) / 3;
      test.runningAverage = runningAverage;
      test.lowAverage = !atLeast(runningAverage, fc);
    }
    return test;
  });
  const ok = evaluated.every((test) => !test.lowIndividual && test.lowAverage !== true);
  return { ok, individualLimit: limit, averageJudged: tests.length >= 3, tests: evaluated };
}

// Published per edition, not converted: ACI 318M's 110 m³ (from memory of the SI edition) is not
// 150 yd³ (114.7 m³). At least five tests per class of concrete; none required for a total under
// 38 m³ (50 yd³) when the building official accepts evidence of satisfactory strength [memory].
export const SAMPLING_LIMITS = {
  SI: { volume: 110, surface: 460, volumeUnit: "m³", surfaceUnit: "m²", smallQuantity: 38 },
  IP: { volume: 150, surface: 5000, volumeUnit: "yd³", surfaceUnit: "ft²", smallQuantity: 50 },
} as const;
export const MIN_TESTS_PER_CLASS = 5;

// ACI 318-19 §26.12.2.1(b) and (c) [memory]: the tests a whole class of concrete needs over the
// project, or none when the total is under the small quantity and the building official agrees.
export function testsForClass({
  totalVolume,
  testsByFrequency,
  unitSystem,
}: {
  /** Total of the class on the project, in m³ (SI) or yd³ (IP). */
  totalVolume: number;
  /** Tests the daily / volume / surface frequency asks for. */
  testsByFrequency: number;
  unitSystem: UnitSystem;
}): { required: number; smallQuantity: boolean } {
  assertNonNegative(totalVolume, "totalVolume", "Total volume of the class");
  assertNonNegative(testsByFrequency, "testsByFrequency", "Tests by frequency");
  if (totalVolume < SAMPLING_LIMITS[unitSystem].smallQuantity) return { required: 0, smallQuantity: true };
  // Fewer than five batches: every batch is tested (§26.12.2.1(b)); otherwise at least five tests.
  return { required: Math.max(MIN_TESTS_PER_CLASS, testsByFrequency), smallQuantity: false };
}

function checkSamplingInput(
  [volume, volumeField]: [number, string],
  [surface, surfaceField]: [number, string],
  days: number,
): void {
  assertPositive(volume, volumeField, "Volume placed");
  // Footings and mass pours have no slab or wall surface, so zero is allowed.
  assertNonNegative(surface, surfaceField, "Slab or wall surface");
  assertPositive(days, "days", "Number of placement days");
  if (!Number.isInteger(days)) throw new ConcreteInputError("days", "Number of placement days must be a whole number");
}

// Counts such as 30 000 ft² → m² → ft² come back as 30 000.000000000004; do not round that up to a test.
const ceilCount = (value: number) => Math.ceil(value - 1e-9);

// ACI 318-19 §26.12.2.1, inch-pound: once a day, per 150 yd³ and per 5000 ft² of slab or wall surface.
export function requiredTestsIP({
  volumeYd3,
  surfaceFt2,
  days,
}: {
  volumeYd3: number;
  surfaceFt2: number;
  days: number;
}): number {
  checkSamplingInput([volumeYd3, "volumeYd3"], [surfaceFt2, "surfaceFt2"], days);
  const { volume, surface } = SAMPLING_LIMITS.IP;
  return Math.max(days, ceilCount(volumeYd3 / volume), ceilCount(surfaceFt2 / surface));
}

// ACI 318-19 §26.12.2.1: once a day, per 110 m³ and per 460 m²; IP projects use the published 150 yd³ / 5000 ft².
export function requiredTests({
  volumeM3,
  surfaceM2,
  days,
  unitSystem = "SI",
}: {
  volumeM3: number;
  surfaceM2: number;
  days: number;
  unitSystem?: UnitSystem;
}): number {
  checkSamplingInput([volumeM3, "volumeM3"], [surfaceM2, "surfaceM2"], days);
  if (unitSystem === "IP") {
    return requiredTestsIP({ volumeYd3: m3ToYd3(volumeM3), surfaceFt2: m2ToFt2(surfaceM2), days });
  }
  const { volume, surface } = SAMPLING_LIMITS.SI;
  return Math.max(days, ceilCount(volumeM3 / volume), ceilCount(surfaceM2 / surface));
}

export interface CoreAcceptance {
  ok: boolean;
  average: number;
  averageOk: boolean;
  noneLow: boolean;
  averageLimit: number;
  individualLimit: number;
  note: string;
}

// UFGS 03300 (and ACI 318 §26.12.6): cores adequate when their average ≥ 0.85 f'c and none < 0.75 f'c.
export function coreAcceptance(coreStrengths: number[], fc: number): CoreAcceptance {
  assertPositive(fc, "fc", "Specified strength f'c");
  if (coreStrengths.length < 3) {
    throw new ConcreteInputError("coreStrengths", "Core acceptance needs at least three cores");
  }
  coreStrengths.forEach((value, i) => assertNonNegative(value, `coreStrengths[${i}]`, "Core strength"));
  const average = coreStrengths.reduce((sum, value) => sum + value, 0) / coreStrengths.length;
  const averageLimit = (fc * 85) / 100;
  const individualLimit = (fc * 75) / 100;
  const averageOk = atLeast(average, averageLimit);
  const noneLow = coreStrengths.every((value) => atLeast(value, individualLimit));
  return {
    ok: averageOk && noneLow,
    average,
    averageOk,
    noneLow,
    averageLimit,
    individualLimit,
    note: STRUCTURAL_ADEQUACY_NOTE,
  };
}
