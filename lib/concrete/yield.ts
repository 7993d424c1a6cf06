// Density (unit weight), yield and gravimetric air content of fresh concrete (ASTM C138).
import { ConcreteInputError, assertPositive } from "./errors";

// ASTM C138: D = (Mc − Mm) / Vm, the filled measure less the empty measure over its volume; kg/m³.
export function density({
  fullMassKg,
  emptyMassKg,
  volumeM3,
}: {
  fullMassKg: number;
  emptyMassKg: number;
  volumeM3: number;
}): number {
  assertPositive(fullMassKg, "fullMassKg", "Mass of the filled measure");
  assertPositive(emptyMassKg, "emptyMassKg", "Mass of the empty measure");
  assertPositive(volumeM3, "volumeM3", "Volume of the measure");
  if (fullMassKg <= emptyMassKg) {
    throw new ConcreteInputError("fullMassKg", "The filled measure must weigh more than the empty measure");
  }
  return (fullMassKg - emptyMassKg) / volumeM3;
}

export interface YieldResult {
  volumeM3: number;
  /** Above 1 the batch makes more concrete than designed (often extra air); below 1, less. */
  relativeYield: number;
}

// ASTM C138: Y = M / D (total batch mass over measured density); Ry = Y / Y design.
export function concreteYield({
  batchMassKg,
  densityKgM3,
  designVolumeM3,
}: {
  batchMassKg: number;
  densityKgM3: number;
  designVolumeM3: number;
}): YieldResult {
  assertPositive(batchMassKg, "batchMassKg", "Batch mass");
  assertPositive(densityKgM3, "densityKgM3", "Density");
  assertPositive(designVolumeM3, "designVolumeM3", "Design volume");
  const volumeM3 = batchMassKg / densityKgM3;
  return { volumeM3, relativeYield: volumeM3 / designVolumeM3 };
}

// ASTM C138: A = (T − D) / T × 100; both densities in the same unit, so the ratio needs none.
export function gravimetricAirPct({
  theoreticalDensity,
  measuredDensity,
}: {
  theoreticalDensity: number;
  measuredDensity: number;
}): number {
  assertPositive(theoreticalDensity, "theoreticalDensity", "Theoretical density");
  assertPositive(measuredDensity, "measuredDensity", "Measured density");
  // Not clamped: a negative result means the theoretical density is wrong, and the user should see it.
  return ((theoreticalDensity - measuredDensity) / theoreticalDensity) * 100;
}
