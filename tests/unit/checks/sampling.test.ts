// Cylinders for structural concrete: ACI 318-19 §26.12.2.1 [memory: clause number] asks for strength
// samples at least once a day for each class of concrete, so a placement of a mix specified by f'c
// with accepted concrete and no specimen set is a gap the signer must see.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/checks";
import { samplingFindings } from "@/lib/checks/sampling";
import { delivery, input, placement } from "./fixtures";

const set = { id: "s1", placementId: "p1", setCode: "LC-P2-A", castAt: new Date("2026-07-14T15:50:00Z"), cylinderDiameterMm: 150 };

describe("no cylinders made (ACI 318-19 §26.12.2.1)", () => {
  it("accepted concrete of an f'c mix and no specimen set: one caution on the placement, on its planned day", () => {
    const findings = samplingFindings(input({ deliveries: [delivery(), delivery({ id: "d2" })] }));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ rule: "sampling-frequency", severity: "caution", subject: { type: "placement", id: "p1" }, placementId: "p1" });
    expect(findings[0].at).toBe("2026-07-14T14:00:00.000Z");
    expect(findings[0].title).toContain("No cylinders made");
    // evaluate() carries it, so every surface shows it.
    expect(evaluate(input({ deliveries: [delivery()] })).map((f) => f.rule)).toContain("sampling-frequency");
  });

  it("a specimen set on the placement clears it", () => {
    expect(samplingFindings(input({ deliveries: [delivery()], specimenSets: [set] }))).toEqual([]);
  });

  it("nothing placed yet, only rejected trucks, or no mix: nothing to say", () => {
    expect(samplingFindings(input())).toEqual([]);
    expect(samplingFindings(input({ deliveries: [delivery({ status: "rejected" })] }))).toEqual([]);
    expect(samplingFindings(input({ placements: [placement({ mix: null })], deliveries: [delivery()] }))).toEqual([]);
  });

  it("a set on another placement does not count for this one", () => {
    expect(samplingFindings(input({ deliveries: [delivery()], specimenSets: [{ ...set, placementId: "p2" }] }))).toHaveLength(1);
  });
});
