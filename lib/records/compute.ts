// Server-computed fields: derived from the measured values with lib/concrete, never taken from the
// client, and recomputed on every write.
import {
  cToF,
  cylinderStrengthMPa,
  evaporationRateIP,
  evaporationRateSI,
  kmhToMph,
  lbFt2hToKgM2h,
  type UnitSystem,
} from "@/lib/concrete";

export type ComputeContext = { unitSystem: UnitSystem };

// ASTM C39: strength from the maximum load and the cylinder size, L/D-corrected when the length is known.
export function computeBreak(values: Record<string, unknown>): { strengthMPa: number } {
  const lengthMm = values.lengthMm as number | null | undefined;
  return {
    strengthMPa: cylinderStrengthMPa({
      maxLoadKN: values.loadKN as number,
      diameterMm: values.diameterMm as number,
      lengthMm: lengthMm ?? undefined,
    }),
  };
}

// ACI 305R nomograph (Uno 1998) in the project's unit system, as DOMAIN.md asks (the two published
// forms differ by ~4 %), stored in kg/m²/h. Without a concrete temperature there is no estimate.
export function computeWeather(values: Record<string, unknown>, { unitSystem }: ComputeContext) {
  const concreteTempC = values.concreteTempC as number | null | undefined;
  if (concreteTempC === null || concreteTempC === undefined) return { evaporationKgM2H: null };
  const airTempC = values.airTempC as number;
  const relativeHumidityPct = values.relativeHumidityPct as number;
  const windKmh = values.windKmh as number;
  const evaporationKgM2H =
    unitSystem === "SI"
      ? evaporationRateSI({ concreteTempC, airTempC, relativeHumidityPct, windKmh })
      : lbFt2hToKgM2h(
          evaporationRateIP({
            concreteTempF: cToF(concreteTempC),
            airTempF: cToF(airTempC),
            relativeHumidityPct,
            windMph: kmhToMph(windKmh),
          }),
        );
  return { evaporationKgM2H };
}
