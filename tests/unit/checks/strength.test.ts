// The rulebook's strength findings: cylinders counted into strength tests as ACI 318 does (issue
// item 5), judged at the design age against §26.12.3.1(b): f'c − 3.5 MPa (500 psi) up to 35 MPa
// (5000 psi), 0.90 f'c above [../shared DOMAIN §5].
import { describe, expect, it } from "vitest";
import { strengthFindings } from "@/lib/checks/strength";
import { input, mix, placement, project } from "./fixtures";

const set = (diameter: number) => ({ id: "s1", placementId: "p1", setCode: "LC-P2-A", castAt: new Date("2026-06-16T15:00:00Z"), cylinderDiameterMm: diameter });
const breakOf = (i: number, strengthMPa: number, ageDays = 28) => ({ id: `b${i}`, specimenSetId: "s1", testedAt: new Date(`2026-07-14T1${i}:00:00Z`), ageDays, strengthMPa });

describe("strength tests per ACI 318", () => {
  it("one broken 150 mm cylinder is not a strength test: information, never 'low strength'", () => {
    const findings = strengthFindings(input({ specimenSets: [set(150)], breaks: [breakOf(1, 15)] }));
    expect(findings.map((f) => [f.rule, f.severity])).toEqual([["strength-incomplete", "info"]]);
    expect(findings[0].title).toContain("1 of 2 cylinders broken");
  });

  it("two 150 mm cylinders averaging below f'c − 3.5 MPa are a low strength test (f'c 27.6 → limit 24.1 MPa)", () => {
    const [f] = strengthFindings(input({ specimenSets: [set(150)], breaks: [breakOf(1, 23.5), breakOf(2, 24.5)] }));
    expect(f).toMatchObject({ rule: "strength-low", severity: "warning" });
    expect(f.applied.limit).toBeCloseTo(24.1, 9);
    expect(f.message).toContain("engineer of record");
    expect(f.message).toContain("85 %");
    expect(strengthFindings(input({ specimenSets: [set(150)], breaks: [breakOf(1, 24), breakOf(2, 24.2)] }))).toEqual([]);
  });

  it("100 mm cylinders need three [src: ACI FAQ citing ACI 318]", () => {
    expect(strengthFindings(input({ specimenSets: [set(100)], breaks: [breakOf(1, 20), breakOf(2, 20)] }))[0].rule).toBe("strength-incomplete");
    expect(strengthFindings(input({ specimenSets: [set(100)], breaks: [breakOf(1, 20), breakOf(2, 20), breakOf(3, 20)] }))[0].rule).toBe("strength-low");
  });

  it("inch-pound, f'c 4000 psi: a 3450 psi test is low (limit 3500 psi), 3500 is not [DOMAIN §5]", () => {
    const psi = (v: number) => v * 0.006894757;
    const p = placement({ mix: mix({ fcMPa: psi(4000) }) });
    const ip = project({ unitSystem: "IP" });
    const low = strengthFindings(input({ project: ip, placements: [p], specimenSets: [set(150)], breaks: [breakOf(1, psi(3400)), breakOf(2, psi(3500))] }));
    expect(low[0].applied).toMatchObject({ limit: 3500, unit: "psi" });
    expect(low[0].applied.value).toBeCloseTo(3450, 6);
    expect(strengthFindings(input({ project: ip, placements: [p], specimenSets: [set(150)], breaks: [breakOf(1, psi(3500)), breakOf(2, psi(3500))] }))).toEqual([]);
  });

  it("early ages are not judged against f'c", () => {
    expect(strengthFindings(input({ specimenSets: [set(150)], breaks: [breakOf(1, 15, 7), breakOf(2, 15, 7)] }))).toEqual([]);
  });
});

describe("strength findings: what they name and say (ACI 318-19 §26.12.3.1(b); cores per UFGS 03300)", () => {
  const late = (i: number, strengthMPa: number, hour: string) => ({ ...breakOf(i, strengthMPa), testedAt: new Date(`2026-07-14T${hour}:00:00Z`) });

  it("a low test is dated by its last break and names the set, the placement, the limit, the rule and the next steps", () => {
    const [f] = strengthFindings(input({ specimenSets: [set(150)], breaks: [late(1, 23.5, "16"), late(2, 24.5, "11")] }));
    expect(f.subject).toEqual({ type: "strength-test", id: "s1:28" });
    expect(f.at).toBe("2026-07-14T16:00:00.000Z");
    expect(strengthFindings(input({ specimenSets: [set(150)], breaks: [late(1, 23.5, "11"), late(2, 24.5, "16")] }))[0].at).toBe("2026-07-14T16:00:00.000Z");
    expect(f.title).toBe("Low strength test: set LC-P2-A (Level 2 deck), 28 days, 24.0 MPa");
    expect(f.message).toBe(
      "The average of 2 cylinders, 24.0 MPa, is below the 24.1 MPa limit for f′c 27.6 MPa. " +
        "ACI 318-19 §26.12.3.1(b): no strength test below f′c − 3.5 MPa (500 psi) when f′c ≤ 35 MPa (5000 psi), nor below 0.90 f′c above that. " +
        "Investigate the result; if low strength is confirmed, cores (ASTM C42) are usually judged adequate when three average at least 85 % of f′c and none is below 75 %. " +
        "These checks compare test results with the specified limits; whether the structure is adequate is the engineer of record's decision.",
    );
    expect(f.applied).toMatchObject({ value: 24, unit: "MPa" });
    expect(f.source).toEqual({ document: "ACI 318", edition: "19", clause: "§26.12.3.1(b)", basis: "published" });
  });

  it("inch-pound: the limit is quoted in psi (3500 psi for f'c 4000 psi) [DOMAIN §5]", () => {
    const p = placement({ mix: mix({ fcMPa: 4000 * 0.006894757 }) });
    const [f] = strengthFindings(input({ project: project({ unitSystem: "IP" }), placements: [p], specimenSets: [set(150)], breaks: [breakOf(1, 3400 * 0.006894757), breakOf(2, 3500 * 0.006894757)] }));
    expect(f.message).toContain("is below the 3500 psi limit for f′c 4000 psi.");
  });

  it("a set whose placement is not in the input: the short test is still counted, nothing is judged against an unknown mix", () => {
    const orphan = { ...set(150), placementId: "elsewhere" };
    const [info] = strengthFindings(input({ specimenSets: [orphan], breaks: [breakOf(1, 15)] }));
    expect(info.title).toBe("Not yet a strength test: set LC-P2-A, 28 days, 1 of 2 cylinders broken");
    expect(info.message).toBe(
      "ACI 318 counts the average of at least two 150 × 300 mm (6 × 12 in) or three 100 × 200 mm (4 × 8 in) cylinders as one strength test; one cylinder is not judged on its own. Mean so far 15.0 MPa.",
    );
    expect(info.applied).toEqual({ value: 1, limit: 2, unit: "cylinders" });
    expect(info.source).toEqual({ document: "ACI 318", edition: "19", clause: "§26.12.1.1", basis: "memory" });
    expect(strengthFindings(input({ specimenSets: [orphan], breaks: [breakOf(1, 15), breakOf(2, 15)] }))).toEqual([]);
  });
});
