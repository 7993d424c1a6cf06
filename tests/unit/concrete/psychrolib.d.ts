// Types for the parts of the CommonJS package `psychrolib` (ASHRAE Handbook Fundamentals
// 2017 ch. 1) that lib/concrete/psychro.ts uses; the package ships no declarations.
declare module "psychrolib" {
  interface Psychrolib {
    readonly IP: 1;
    readonly SI: 2;
    SetUnitSystem(unitSystem: 1 | 2): void;
    GetUnitSystem(): 1 | 2 | undefined;
    /** Saturation vapour pressure: psi for °F input [IP], Pa for °C input [SI]. */
    GetSatVapPres(tDryBulb: number): number;
    /** Dew point in the current unit system; relHum is 0–1. */
    GetTDewPointFromRelHum(tDryBulb: number, relHum: number): number;
  }
  const psychrolib: Psychrolib;
  export = psychrolib;
}
