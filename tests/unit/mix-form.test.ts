// The mix form converts at the edge: what a user types in inch-pound units is stored in SI and
// checked by the shared schema, with its limits read back in the user's units.
import { describe, expect, it } from "vitest";
import { psiToMPa, inToMm, fToC } from "@/lib/concrete/units";
import { checkMixForm, formDefaults, formToRecord, localiseMessage, type MixFormValues } from "@/lib/mixes/form";
import { L_PER_M3_PER_GAL_PER_YD3 } from "@/lib/mixes/units";

const ID = "5eed0000-0000-4000-8000-000000000999";
const typed = (over: Partial<MixFormValues> = {}): MixFormValues => ({
  ...formDefaults(null, "IP"),
  code: "LC-4000-A",
  supplier: "Brindlewood Ready-Mix",
  fcMPa: "4000",
  slumpTargetMm: "4",
  airTargetPct: "5.5",
  maxConcreteTempC: "95",
  siteWaterAllowedLPerM3: "1",
  ...over,
});

describe("mix form", () => {
  it("stores inch-pound input in SI", () => {
    const check = checkMixForm(typed(), "IP", ID);
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.values.fcMPa).toBeCloseTo(psiToMPa(4000), 9);
    expect(check.values.slumpTargetMm).toBeCloseTo(inToMm(4), 9);
    expect(check.values.maxConcreteTempC).toBeCloseTo(fToC(95), 9);
    expect(check.values.siteWaterAllowedLPerM3).toBeCloseTo(4.9511, 4); // 1 gal/yd³
    expect(check.values.maxWcm).toBeNull();
    expect(check.values.fcAgeDays).toBe(28);
  });

  it("shows stored SI values rounded in the project's units, and round-trips them", () => {
    const shown = formDefaults({ fcMPa: psiToMPa(4000), slumpTargetMm: inToMm(4), maxConcreteTempC: 35, siteWaterAllowedLPerM3: L_PER_M3_PER_GAL_PER_YD3, lowBleed: true }, "IP");
    expect(shown).toMatchObject({ fcMPa: "4000", slumpTargetMm: "4", maxConcreteTempC: "95", siteWaterAllowedLPerM3: "1", lowBleed: true, maxWcm: "" });
    expect(formDefaults({ fcMPa: 30, slumpTargetMm: 100 }, "SI")).toMatchObject({ fcMPa: "30", slumpTargetMm: "100" });
  });

  it("names the field in the user's words and units", () => {
    const check = checkMixForm(typed({ fcMPa: "900", slumpTargetMm: "abc", code: " " }), "IP", ID);
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors.fcMPa).toBe("Specified strength must be between 1450 and 21756 psi");
    expect(check.errors.slumpTargetMm).toBe("Slump must be a number");
    expect(check.errors.code).toBe("Enter the mix code");
  });

  it("leaves SI messages alone and accepts a decimal comma", () => {
    expect(localiseMessage("fcMPa", "Specified strength must be between 10 and 150 MPa", "SI")).toBe("Specified strength must be between 10 and 150 MPa");
    expect(formToRecord(typed({ maxWcm: "0,45" }), "SI", ID).maxWcm).toBe(0.45);
  });
});
