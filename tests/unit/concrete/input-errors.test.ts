// Every refusal of the formula library, checked by field and exact wording. The field lets a form
// mark the input; the message is what the person on site reads [product rule: bad input always
// gets a clear, specific message and changes nothing].
import { describe, it, expect } from "vitest";

import {
  ConcreteInputError,
  airRangePct,
  checkConcreteTempAtDischarge,
  checkDischarge,
  checkFieldTest,
  checkWaterAddition,
  concreteYield,
  coreAcceptance,
  cylinderStrengthMPa,
  density,
  dewPointC,
  equivalentAgeHours,
  estimateStrength,
  evaluateAcceptance,
  evaporationRateIP,
  evaporationRateSI,
  evaporationRisk,
  fitLogStrengthMaturity,
  formatQuantity,
  gravimetricAirPct,
  isColdWeather,
  lengthDiameterFactor,
  minimumConcreteTempC,
  requiredTests,
  requiredTestsIP,
  saturationVapourPressurePa,
  saturationVapourPressurePsi,
  slumpFlowRangeMm,
  slumpRangeMm,
  strengthTest,
  temperatureTimeFactor,
  withinRange,
  type SlumpType,
} from "../../../lib/concrete";

const NaN_ = Number.NaN;
const t = (hhmm: string) => new Date(`2025-07-14T${hhmm}:00Z`);
const badDate = new Date("not a time");
const reading = (hours: number, tempC: number) => ({ at: new Date(Date.UTC(2025, 0, 6) + hours * 3_600_000), tempC });
const si = { concreteTempC: 25, airTempC: 25, relativeHumidityPct: 50, windKmh: 10 };
const ip = { concreteTempF: 77, airTempF: 77, relativeHumidityPct: 50, windMph: 6 };
const water = { firstAt: t("10:40"), lastAt: t("10:45"), addedLitres: 5, allowedLitres: 30 };
const field = { slumpType: "target" as const, specifiedSlumpMm: 100, specifiedAirPct: 6 };

const cases: [string, () => unknown, string, string][] = [
  // Evaporation (ACI 305R nomograph inputs)
  ["SI concrete temperature", () => evaporationRateSI({ ...si, concreteTempC: 71 }), "concreteTempC", "Concrete temperature must be between -40 and 70 °C"],
  ["SI air temperature", () => evaporationRateSI({ ...si, airTempC: -41 }), "airTempC", "Air temperature must be between -40 and 70 °C"],
  ["SI humidity", () => evaporationRateSI({ ...si, relativeHumidityPct: -1 }), "relativeHumidityPct", "Relative humidity must be between 0 and 100 %"],
  ["SI wind", () => evaporationRateSI({ ...si, windKmh: -1 }), "windKmh", "Wind speed cannot be negative"],
  ["IP concrete temperature", () => evaporationRateIP({ ...ip, concreteTempF: 159 }), "concreteTempF", "Concrete temperature must be between -40 and 158 °F"],
  ["IP air temperature", () => evaporationRateIP({ ...ip, airTempF: -41 }), "airTempF", "Air temperature must be between -40 and 158 °F"],
  ["IP humidity", () => evaporationRateIP({ ...ip, relativeHumidityPct: 101 }), "relativeHumidityPct", "Relative humidity must be between 0 and 100 %"],
  ["IP wind", () => evaporationRateIP({ ...ip, windMph: -1 }), "windMph", "Wind speed cannot be negative"],
  ["negative rate", () => evaporationRisk(-0.1, "SI"), "rate", "Evaporation rate cannot be negative"],
  ["caution threshold NaN", () => evaporationRisk(0.5, "SI", { cautionAt: NaN_ }), "cautionAt", "Caution threshold must be a number"],
  ["high threshold NaN", () => evaporationRisk(0.5, "SI", { highAt: NaN_ }), "highAt", "High threshold must be a number"],
  ["caution above high", () => evaporationRisk(0.5, "SI", { cautionAt: 1.2, highAt: 1 }), "cautionAt", "Caution threshold must not be above the high threshold"],
  // Psychrometrics
  ["vapour pressure °C", () => saturationVapourPressurePa(201), "tempC", "Temperature must be between -100 and 200 °C"],
  ["vapour pressure °F", () => saturationVapourPressurePsi(-149), "tempF", "Temperature must be between -148 and 392 °F"],
  ["dew point temperature", () => dewPointC(-101, 50), "tempC", "Temperature must be between -100 and 200 °C"],
  ["dew point humidity", () => dewPointC(25, 101), "relativeHumidityPct", "Relative humidity must be between 0 and 100 %"],
  // Cold and hot weather
  ["least dimension", () => minimumConcreteTempC(0), "leastDimensionMm", "Least section dimension must be greater than zero"],
  ["cold-weather limit", () => isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 2, thresholdC: NaN_ }), "thresholdC", "Cold-weather limit must be a number"],
  ["no daily means", () => isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [] }), "dailyMeanTempsC", "Enter at least one average daily temperature"],
  ["a daily mean NaN", () => isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [3, NaN_] }), "dailyMeanTempsC[1]", "Temperature must be a number"],
  ["an observed NaN", () => isColdWeather({ definition: "aci306r-current", observedAirTempsC: [NaN_] }), "observedAirTempsC[0]", "Temperature must be a number"],
  ["forecast NaN", () => isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: NaN_ }), "forecastMinAirTempC", "Forecast temperature must be a number"],
  ["no air temperature", () => isColdWeather({ definition: "aci306r-current" }), "forecastMinAirTempC", "Enter an observed or forecast air temperature"],
  ["discharge temperature", () => checkConcreteTempAtDischarge({ concreteTempC: NaN_ }), "concreteTempC", "Concrete temperature must be a number"],
  ["discharge maximum", () => checkConcreteTempAtDischarge({ concreteTempC: 20, maxC: NaN_ }), "maxC", "Maximum concrete temperature must be a number"],
  ["discharge minimum", () => checkConcreteTempAtDischarge({ concreteTempC: 20, minC: NaN_ }), "minC", "Minimum concrete temperature must be a number"],
  // Delivery (ASTM C94)
  ["batch time", () => checkDischarge({ batchedAt: badDate, dischargeFinishedAt: t("10:00") }), "batchedAt", "Batch time must be a valid date and time"],
  ["discharge finish", () => checkDischarge({ batchedAt: t("10:00"), dischargeFinishedAt: badDate }), "dischargeFinishedAt", "Discharge finish time must be a valid date and time"],
  ["discharge limit", () => checkDischarge({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:00"), limitMinutes: 0 }), "limitMinutes", "Discharge time limit must be greater than zero"],
  ["finish before batching", () => checkDischarge({ batchedAt: t("10:00"), dischargeFinishedAt: t("09:59") }), "dischargeFinishedAt", "Discharge cannot finish before the concrete was batched"],
  ["revolution limit", () => checkDischarge({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:00"), revolutionLimit: 0 }), "revolutionLimit", "Revolution limit must be greater than zero"],
  ["revolutions", () => checkDischarge({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:00"), revolutionLimit: 300, revolutions: -1 }), "revolutions", "Drum revolutions cannot be negative"],
  ["first water portion", () => checkWaterAddition({ ...water, firstAt: badDate }), "firstAt", "Time of the first water portion must be a valid date and time"],
  ["last water portion", () => checkWaterAddition({ ...water, lastAt: badDate }), "lastAt", "Time of the last water portion must be a valid date and time"],
  ["water added", () => checkWaterAddition({ ...water, addedLitres: -1 }), "addedLitres", "Water added cannot be negative"],
  ["water allowed", () => checkWaterAddition({ ...water, allowedLitres: -1 }), "allowedLitres", "Water allowed cannot be negative"],
  ["last portion first", () => checkWaterAddition({ ...water, lastAt: t("10:39") }), "lastAt", "The last water portion cannot come before the first"],
  // Tolerances (ASTM C94)
  ["specified slump", () => slumpRangeMm(-1, "target"), "specifiedSlumpMm", "Specified slump cannot be negative"],
  ["slump type", () => slumpRangeMm(100, "flow" as SlumpType), "slumpType", "Slump must be specified as a target or a maximum"],
  ["specified air", () => airRangePct(-1), "specifiedAirPct", "Specified air content cannot be negative"],
  ["specified slump flow", () => slumpFlowRangeMm(-1), "specifiedSlumpFlowMm", "Specified slump flow cannot be negative"],
  ["test result", () => withinRange(NaN_, { min: 0 }), "value", "Test result must be a number"],
  ["slump", () => checkFieldTest({ ...field, slumpMm: -1 }), "slumpMm", "Slump cannot be negative"],
  ["air content", () => checkFieldTest({ ...field, airPct: -1 }), "airPct", "Air content cannot be negative"],
  ["concrete temperature", () => checkFieldTest({ ...field, concreteTempC: NaN_ }), "concreteTempC", "Concrete temperature must be a number"],
  // Density and yield (ASTM C138)
  ["filled measure", () => density({ fullMassKg: 0, emptyMassKg: 3.2, volumeM3: 0.007 }), "fullMassKg", "Mass of the filled measure must be greater than zero"],
  ["empty measure", () => density({ fullMassKg: 19.9, emptyMassKg: 0, volumeM3: 0.007 }), "emptyMassKg", "Mass of the empty measure must be greater than zero"],
  ["measure volume", () => density({ fullMassKg: 19.9, emptyMassKg: 3.2, volumeM3: 0 }), "volumeM3", "Volume of the measure must be greater than zero"],
  ["filled as heavy as empty", () => density({ fullMassKg: 3.2, emptyMassKg: 3.2, volumeM3: 0.007 }), "fullMassKg", "The filled measure must weigh more than the empty measure"],
  ["batch mass", () => concreteYield({ batchMassKg: 0, densityKgM3: 2400, designVolumeM3: 8 }), "batchMassKg", "Batch mass must be greater than zero"],
  ["density", () => concreteYield({ batchMassKg: 19_200, densityKgM3: 0, designVolumeM3: 8 }), "densityKgM3", "Density must be greater than zero"],
  ["design volume", () => concreteYield({ batchMassKg: 19_200, densityKgM3: 2400, designVolumeM3: 0 }), "designVolumeM3", "Design volume must be greater than zero"],
  ["theoretical density", () => gravimetricAirPct({ theoreticalDensity: 0, measuredDensity: 2300 }), "theoreticalDensity", "Theoretical density must be greater than zero"],
  ["measured density", () => gravimetricAirPct({ theoreticalDensity: 2400, measuredDensity: 0 }), "measuredDensity", "Measured density must be greater than zero"],
  // Strength (ASTM C39, ACI 318)
  ["L/D NaN", () => lengthDiameterFactor(NaN_), "lengthMm", "Length/diameter ratio must be a number"],
  ["L/D below 1", () => lengthDiameterFactor(0.99), "lengthMm", "Specimens shorter than their diameter cannot be corrected (L/D below 1.0)"],
  ["maximum load", () => cylinderStrengthMPa({ maxLoadKN: 0, diameterMm: 150 }), "maxLoadKN", "Maximum load must be greater than zero"],
  ["diameter", () => cylinderStrengthMPa({ maxLoadKN: 500, diameterMm: 0 }), "diameterMm", "Diameter must be greater than zero"],
  ["length", () => cylinderStrengthMPa({ maxLoadKN: 500, diameterMm: 150, lengthMm: 0 }), "lengthMm", "Length must be greater than zero"],
  ["cylinder diameter", () => strengthTest([30, 31], { diameterMm: 0 }), "diameterMm", "Cylinder diameter must be greater than zero"],
  ["one 150 mm cylinder", () => strengthTest([30]), "cylinderStrengths", "A strength test needs at least 2 cylinders of this size"],
  ["a cylinder of zero", () => strengthTest([30, 0]), "cylinderStrengths[1]", "Cylinder strength must be greater than zero"],
  ["f'c", () => evaluateAcceptance({ fc: 0, tests: [30], unitSystem: "SI" }), "fc", "Specified strength f'c must be greater than zero"],
  ["no tests", () => evaluateAcceptance({ fc: 30, tests: [], unitSystem: "SI" }), "tests", "Enter at least one strength test"],
  ["negative test", () => evaluateAcceptance({ fc: 30, tests: [30, -1], unitSystem: "SI" }), "tests[1]", "Strength test cannot be negative"],
  ["volume placed", () => requiredTests({ volumeM3: 0, surfaceM2: 0, days: 1 }), "volumeM3", "Volume placed must be greater than zero"],
  ["surface", () => requiredTests({ volumeM3: 10, surfaceM2: -1, days: 1 }), "surfaceM2", "Slab or wall surface cannot be negative"],
  ["IP surface", () => requiredTestsIP({ volumeYd3: 10, surfaceFt2: -1, days: 1 }), "surfaceFt2", "Slab or wall surface cannot be negative"],
  ["days", () => requiredTests({ volumeM3: 10, surfaceM2: 0, days: 0 }), "days", "Number of placement days must be greater than zero"],
  ["fractional days", () => requiredTests({ volumeM3: 10, surfaceM2: 0, days: 1.5 }), "days", "Number of placement days must be a whole number"],
  ["core f'c", () => coreAcceptance([26, 27, 28], 0), "fc", "Specified strength f'c must be greater than zero"],
  ["two cores", () => coreAcceptance([26, 27], 30), "coreStrengths", "Core acceptance needs at least three cores"],
  ["negative core", () => coreAcceptance([26, 27, -1], 30), "coreStrengths[2]", "Core strength cannot be negative"],
  // Maturity (ASTM C1074)
  ["one reading", () => temperatureTimeFactor([reading(0, 20)]), "readings", "At least two temperature readings are needed"],
  ["reading time", () => temperatureTimeFactor([reading(0, 20), { at: badDate, tempC: 20 }]), "readings[1].at", "Reading time must be a valid date and time"],
  ["reading temperature", () => temperatureTimeFactor([reading(0, 20), reading(1, NaN_)]), "readings[1].tempC", "Temperature must be a number"],
  ["readings out of order", () => temperatureTimeFactor([reading(2, 20), reading(1, 20)]), "readings[1].at", "Temperature readings must be in time order"],
  ["datum", () => temperatureTimeFactor([reading(0, 20), reading(1, 20)], NaN_), "datumC", "Datum temperature must be a number"],
  ["activation energy", () => equivalentAgeHours([reading(0, 20), reading(1, 20)], { activationEnergyJPerMol: 0 }), "activationEnergyJPerMol", "Activation energy must be greater than zero"],
  ["reference temperature", () => equivalentAgeHours([reading(0, 20), reading(1, 20)], { referenceC: NaN_ }), "referenceC", "Reference temperature must be a number"],
  ["below absolute zero", () => equivalentAgeHours([reading(0, -300), reading(1, -300)]), "readings", "Temperature readings are below absolute zero"],
  ["at absolute zero", () => equivalentAgeHours([reading(0, -273.15), reading(1, -273.15)]), "readings", "Temperature readings are below absolute zero"],
  ["one calibration point", () => fitLogStrengthMaturity([{ maturity: 100, strength: 10 }]), "points", "At least two calibration points are needed"],
  ["calibration maturity", () => fitLogStrengthMaturity([{ maturity: 100, strength: 10 }, { maturity: 0, strength: 0 }]), "points[1].maturity", "Maturity must be greater than zero"],
  ["calibration strength", () => fitLogStrengthMaturity([{ maturity: 100, strength: 10 }, { maturity: 200, strength: NaN_ }]), "points[1].strength", "Strength must be a number"],
  ["one maturity", () => fitLogStrengthMaturity([{ maturity: 500, strength: 10 }, { maturity: 500, strength: 12 }]), "points", "Calibration points need at least two different maturities"],
  ["estimate maturity", () => estimateStrength({ a: 0, b: 1 }, 0), "maturity", "Maturity must be greater than zero"],
  // Display
  ["value to format", () => formatQuantity("strength", NaN_, "SI"), "strength", "Value must be a number"],
];

describe("input errors name the field and say what is wrong [product rule: clear, specific message]", () => {
  it.each(cases)("%s", (_name, call, expectedField, expectedMessage) => {
    let caught: unknown;
    try {
      call();
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(ConcreteInputError);
    expect(caught).toMatchObject({ field: expectedField, message: expectedMessage });
  });
});
