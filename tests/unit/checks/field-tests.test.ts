// The rulebook's fresh-concrete checks against the mix. ASTM C94 slump bands and ±1.5 points of air
// [memory, ../shared DOMAIN §3]; the mix's own tolerances win where it states them (issue item 4);
// the check-test wording of ASTM C94 (issue item 7); ACI 305.1-14 §3.3.1 maximum 35 °C / 95 °F.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/checks";
import { fieldTestFindings } from "@/lib/checks/field-tests";
import { fToC, fieldTest, input, inToMm, mix, project } from "./fixtures";

describe("slump and air against the mix", () => {
  it("C94 default: a 100 mm target allows ±25 mm → 125 passes, 126 does not [DOMAIN §3, memory]", () => {
    expect(fieldTestFindings(fieldTest({ slumpMm: 125 }), mix(), project())).toEqual([]);
    const [f] = fieldTestFindings(fieldTest({ slumpMm: 126 }), mix(), project());
    expect(f).toMatchObject({ rule: "slump", severity: "warning", applied: { value: 126, limit: 125, unit: "mm" } });
    expect(f.source.basis).toBe("memory");
  });

  it("the mix's own ±20 mm wins over C94's ±25 mm: 121 mm is out", () => {
    const own = mix({ slumpToleranceMm: 20 });
    expect(fieldTestFindings(fieldTest({ slumpMm: 120 }), own, project())).toEqual([]);
    const [f] = fieldTestFindings(fieldTest({ slumpMm: 121 }), own, project());
    expect(f.rule).toBe("slump");
    expect(f.source).toEqual({ document: "Mix design (project specification)", basis: "project" });
  });

  it("the mix's own ±1.0 air tolerance wins over C94's ±1.5: 7.2 % on a 6 % target is out", () => {
    expect(fieldTestFindings(fieldTest({ airPct: 7.2 }), mix(), project())).toEqual([]);
    const [f] = fieldTestFindings(fieldTest({ airPct: 7.2 }), mix({ airTolerancePct: 1 }), project());
    expect(f).toMatchObject({ rule: "air-content", title: "Air content out of tolerance: 7.2 % (range 5.0–7.0 %)" });
  });

  it("inch-pound: a 4 in target allows 3–5 in (C94, 2 to 4 in: ±1 in); 5.5 in is out, shown in inches", () => {
    const m = mix({ slumpTargetMm: inToMm(4) });
    expect(fieldTestFindings(fieldTest({ slumpMm: inToMm(5) }), m, project({ unitSystem: "IP" }))).toEqual([]);
    const [f] = fieldTestFindings(fieldTest({ slumpMm: inToMm(5.5) }), m, project({ unitSystem: "IP" }));
    expect(f.title).toBe("Slump out of tolerance: 5.5 in (range 3.0–5.0 in)");
    expect(f.applied.unit).toBe("in");
  });
});

describe("ASTM C94 check test wording (issue item 7)", () => {
  it("another portion of the same sample; failed the specification; the purchaser decides", () => {
    const [f] = fieldTestFindings(fieldTest({ slumpMm: 160 }), mix(), project());
    expect(f.message).toContain("check test at once on another portion of the same sample");
    expect(f.message).toContain("the concrete has failed the specification");
    expect(f.message).toContain("purchaser's decision");
    expect(f.message).not.toMatch(/load is rejected/);
  });

  it("a later test of the same load within range clears it to a caution", () => {
    const first = fieldTest({ slumpMm: 160 });
    const check = fieldTest({ id: "t2", slumpMm: 110, sampledAt: new Date("2026-07-14T15:50:00Z") });
    const findings = evaluate(input({ fieldTests: [first, check] }));
    expect(findings.map((f) => [f.subject.id, f.rule, f.severity])).toEqual([["t1", "slump", "caution"]]);
    expect(findings[0].message).toContain("A check test on the same load was within range");
  });
});

describe("concrete temperature (project specification; ACI 305.1 default)", () => {
  it("inch-pound: 95 °F is the published maximum; 96 °F is 'Above the maximum temperature', with no C94 check-test text", () => {
    const ip = project({ unitSystem: "IP" });
    expect(fieldTestFindings(fieldTest({ concreteTempC: fToC(95) }), mix(), ip)).toEqual([]);
    const [f] = fieldTestFindings(fieldTest({ concreteTempC: fToC(96) }), mix(), ip);
    expect(f.title).toBe("Above the maximum temperature: 96.0 °F (maximum 95 °F)");
    expect(f.source).toEqual({ document: "ACI 305.1", edition: "14", clause: "§3.3.1", basis: "published" });
    expect(f.message).not.toContain("another portion of the same sample");
  });

  it("the mix's maximum wins (32 °C), named as the project's", () => {
    const [f] = fieldTestFindings(fieldTest({ concreteTempC: 33 }), mix({ maxConcreteTempC: 32 }), project());
    expect(f.applied).toEqual({ value: 33, limit: 32, unit: "°C" });
    expect(f.source.basis).toBe("project");
  });
});
