// The project specification form: values typed in the project's units reach the server in SI, and
// a value out of range is refused with the range in the person's own units.
import { describe, expect, it } from "vitest";
import { projectSpecSchema, specChange, specFormValues, type ProjectSpec } from "@/lib/projects/spec";

const STORED: ProjectSpec = {
  evaporationHighKgM2H: null,
  maxConcreteTempC: 35,
  dischargeLimitMinutes: 90,
  revolutionLimit: null,
  coldWeatherDefinition: "aci306r-current",
  specEditions: "",
  maturityMethod: "nurse-saul",
  maturityDatumC: 0,
  maturityActivationEnergyJPerMol: 41_570,
  maturityTargetMPa: null,
};

const issues = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((result.error?.issues ?? []).map((i) => [String(i.path[0] ?? ""), i.message]));

describe("project specification in inch-pound units", () => {
  it("shows the stored SI values in °F, psi and lb/ft²/h (NIST SP 811 factors)", () => {
    const form = specFormValues({ ...STORED, evaporationHighKgM2H: 0.5, maturityTargetMPa: 20 }, "IP");
    expect(form.maxConcreteTempC).toBe("95"); // 35 °C = 95 °F by definition of the scales
    expect(form.maturityDatumC).toBe("32");
    expect(Number(form.maturityTargetMPa)).toBeCloseTo(2900.75, 1); // 20 MPa / 0.006894757
    expect(Number(form.evaporationHighKgM2H)).toBeCloseTo(0.102, 3); // 0.5 / 4.882428
    expect(form.maturityActivationEnergyJPerMol).toBe("41.57"); // kJ/mol
    expect(form.revolutionLimit).toBe("");
  });

  it("sends only the changed fields, converted to SI", () => {
    const form = { ...specFormValues(STORED, "IP"), maxConcreteTempC: "90", maturityTargetMPa: "3000", revolutionLimit: "" };
    const change = specChange(form, ["maxConcreteTempC", "maturityTargetMPa", "revolutionLimit"], "IP");
    expect(change.maxConcreteTempC).toBeCloseTo(32.222, 3); // (90 − 32) × 5/9
    expect(change.maturityTargetMPa).toBeCloseTo(20.684, 3); // 3000 psi × 0.006894757
    expect(change.revolutionLimit).toBeNull(); // blank: no limit unless the order states one
    expect(projectSpecSchema("IP").safeParse(change).success).toBe(true);
  });

  it("refuses a Celsius figure typed into an inch-pound project, naming the range in °F", () => {
    const change = specChange({ ...specFormValues(STORED, "IP"), maxConcreteTempC: "35" }, ["maxConcreteTempC"], "IP");
    const result = projectSpecSchema("IP").safeParse(change);
    expect(result.success).toBe(false);
    expect(issues(result).maxConcreteTempC).toBe("The maximum concrete temperature must be between 59 °F and 113 °F.");
  });

  it("names the same range in °C on an SI project", () => {
    const result = projectSpecSchema("SI").safeParse({ maxConcreteTempC: 95 });
    expect(issues(result).maxConcreteTempC).toBe("The maximum concrete temperature must be between 15 °C and 45 °C.");
  });
});

describe("project specification checks", () => {
  const schema = projectSpecSchema("SI");

  it("refuses text that is not a number, and a fractional minute count", () => {
    expect(issues(schema.safeParse(specChange({ ...specFormValues(STORED, "SI"), dischargeLimitMinutes: "ninety" }, ["dischargeLimitMinutes"], "SI"))).dischargeLimitMinutes).toMatch(/discharge time limit/i);
    expect(issues(schema.safeParse({ dischargeLimitMinutes: 62.5 })).dischargeLimitMinutes).toBe("The discharge time limit must be a whole number.");
  });

  it("refuses an activation energy typed in J/mol where kJ/mol is asked", () => {
    const change = specChange({ ...specFormValues(STORED, "SI"), maturityActivationEnergyJPerMol: "41570" }, ["maturityActivationEnergyJPerMol"], "SI");
    expect(issues(schema.safeParse(change)).maturityActivationEnergyJPerMol).toBe("The activation energy must be between 20 kJ/mol and 70 kJ/mol.");
  });

  it("refuses fields that are not the specification's, and an empty change", () => {
    const foreign = schema.safeParse({ unitSystem: "SI" });
    // The first message is the one the server answers with (parseOrThrow).
    expect(foreign.error?.issues[0].message).toBe("Only the project specification's values can be changed here.");
    expect(schema.safeParse({}).success).toBe(false);
  });

  it("accepts a blank evaporation limit (back to the published ACI 305R value)", () => {
    expect(schema.safeParse({ evaporationHighKgM2H: null }).success).toBe(true);
  });
});
