// Refusals of the maturity and sampling helpers, by field and exact wording: the field lets a form
// mark the input, the message is what the person reads [product rule: bad input always gets a clear,
// specific message and changes nothing].
import { describe, it, expect } from "vitest";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import { DEFAULT_MATURITY_SETTINGS } from "../../../lib/concrete/maturity";
import { calibrateFromBreaks, estimateWithinCalibration, maturityForStrength, standardCureMaturity } from "../../../lib/concrete/maturity-calibration";
import { findReadingGaps, timeToMaturity } from "../../../lib/concrete/maturity-record";
import { testsForClass } from "../../../lib/concrete/strength";

const fit = { a: -40, b: 25, minMaturity: 500, maxMaturity: 10_000, rSquared: 1 };
const t0 = new Date(Date.UTC(2026, 10, 2, 13));

const cases: [string, () => unknown, string, string][] = [
  ["test age of zero", () => standardCureMaturity(0), "ageDays", "Test age must be greater than zero"],
  ["curing temperature missing", () => standardCureMaturity(7, DEFAULT_MATURITY_SETTINGS, Number.NaN), "cureC", "Curing temperature must be a number"],
  ["a break at age zero", () => calibrateFromBreaks([{ ageDays: 0, strengthMPa: 5 }]), "breaks[0].ageDays", "Test age must be greater than zero"],
  ["a negative break", () => calibrateFromBreaks([{ ageDays: 3, strengthMPa: 5 }, { ageDays: 7, strengthMPa: -1 }]), "breaks[1].strengthMPa", "Strength cannot be negative"],
  ["negative maturity", () => estimateWithinCalibration(fit, -1), "maturity", "Maturity cannot be negative"],
  ["target of zero", () => maturityForStrength(fit, 0), "targetMPa", "Target strength must be greater than zero"],
  ["a falling curve", () => maturityForStrength({ ...fit, b: -1 }, 30), "fit", "The calibration curve must rise with maturity"],
  ["negative target maturity", () => timeToMaturity([{ at: t0, tempC: 20, maturity: 0 }], -1), "targetMaturity", "Target maturity cannot be negative"],
  ["logging interval of zero", () => findReadingGaps([t0], 0), "intervalMinutes", "Logging interval must be greater than zero"],
  ["an invalid now", () => findReadingGaps([t0], 15, new Date(Number.NaN)), "now", "Current time must be a number"],
  ["negative class volume", () => testsForClass({ totalVolume: -1, testsByFrequency: 1, unitSystem: "SI" }), "totalVolume", "Total volume of the class cannot be negative"],
  ["negative test count", () => testsForClass({ totalVolume: 100, testsByFrequency: -1, unitSystem: "SI" }), "testsByFrequency", "Tests by frequency cannot be negative"],
];

describe("maturity and sampling input errors name the field and say what is wrong", () => {
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
