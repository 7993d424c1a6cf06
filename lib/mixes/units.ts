// Site water allowance per volume of concrete: lib/concrete/units has litres and cubic yards
// separately but not the rate; the mix form needs it both ways.
import { L_PER_US_GAL, M3_PER_YD3, type UnitSystem } from "@/lib/concrete/units";

// 1 gal/yd³ = 3.785411784 L / 0.764554858 m³ ≈ 4.951 L/m³ (exact factors, DOMAIN.md "Units").
export const L_PER_M3_PER_GAL_PER_YD3 = L_PER_US_GAL / M3_PER_YD3;

export const waterRateUnit = (unitSystem: UnitSystem) => (unitSystem === "SI" ? "L/m³" : "gal/yd³");
export const waterRateToDisplay = (lPerM3: number, unitSystem: UnitSystem) =>
  unitSystem === "SI" ? lPerM3 : lPerM3 / L_PER_M3_PER_GAL_PER_YD3;
export const waterRateFromDisplay = (value: number, unitSystem: UnitSystem) =>
  unitSystem === "SI" ? value : value * L_PER_M3_PER_GAL_PER_YD3;
