// Edges of the two newest rules, and the words they say to the person on site.
// mix-code: ASTM C94 §14 (the delivery ticket names the concrete delivered); checking it against the
// mix ordered for the placement before discharge is [common practice].
// sampling-frequency: ACI 318-19 §26.12.2.1 [memory: clause number], strength samples at least once a
// day for each class of concrete; the small-quantity waiver is the building official's [memory].
import { describe, expect, it } from "vitest";
import { toCheckInput } from "@/lib/checks";
import { mixCodeFinding } from "@/lib/checks/delivery";
import { samplingFindings } from "@/lib/checks/sampling";
import { GOVERNS } from "@/lib/checks/types";
import { delivery, input, mix, placement } from "./fixtures";

describe("mix-code: the ticket's mix against the placement's [ASTM C94 §14; common practice]", () => {
  const planned = mix({ code: "LC-4000-A" });

  it("spaces, dashes and case do not make another mix; any other character does", () => {
    expect(mixCodeFinding(delivery({ mixCode: "LC4000A" }), planned)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "LC 4000 A" }), planned)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "  lc-4000-a  " }), planned)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "LC-4000-A" }), mix({ code: "lc 4000 a" }))).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "LC_4000_A" }), planned)?.rule).toBe("mix-code");
    expect(mixCodeFinding(delivery({ mixCode: "LC-4000-B" }), planned)?.rule).toBe("mix-code");
    expect(mixCodeFinding(delivery({ mixCode: "LC-4000" }), planned)?.rule).toBe("mix-code");
  });

  it("tells the inspector what to do before the load is placed, names the rule and who governs", () => {
    const f = mixCodeFinding(delivery({ mixCode: "LC-5000-B", truck: "" }), planned)!;
    expect(f.title).toBe("Wrong mix on the ticket: ticket BR-1042 says LC-5000-B, the placement's mix is LC-4000-A");
    expect(f.message).toBe(
      "The ticket names mix LC-5000-B; this placement was planned with LC-4000-A. Confirm with the supplier and the " +
        "engineer of record before the load is placed; a load of the wrong mix is usually rejected.",
    );
    expect(f.source).toEqual({ document: "ASTM C94", clause: "§14 delivery ticket", basis: "practice" });
    expect(f.governs).toBe(GOVERNS);
    expect(f.placementId).toBe("p1");
    expect(f.at).toBe("2026-07-14T15:35:00.000Z"); // the truck's arrival
    expect(f.applied).toEqual({ value: null, limit: null, unit: "" });
  });

  it("an empty code is no code", () => {
    expect(mixCodeFinding(delivery({ mixCode: "" }), planned)).toBeNull();
  });

  it("a stored ticket's code is read trimmed; blank or missing is no code", () => {
    const iso = "2026-07-14T15:35:00.000Z";
    const codeOf = (mixCode: unknown) =>
      toCheckInput({ project: {}, mixes: [], placements: [], deliveries: [{ id: "d1", batchedAt: iso, arrivedAt: iso, mixCode }] }).deliveries[0].mixCode;
    expect(codeOf("  LC-5000-B ")).toBe("LC-5000-B");
    expect(codeOf("   ")).toBeNull();
    expect(codeOf(null)).toBeNull();
    expect(codeOf(42)).toBeNull();
  });
});

describe("no cylinders made [ACI 318-19 §26.12.2.1, memory]", () => {
  it("says how many trucks were placed, what to do next and on what authority", () => {
    const [one] = samplingFindings(input({ deliveries: [delivery()] }));
    expect(one.title).toBe("No cylinders made: Level 2 deck, mix LC-4000-A");
    expect(one.message).toBe(
      "Concrete from a mix specified by strength was placed (1 truck) and no specimen set is recorded. " +
        "ACI 318 asks for strength samples at least once a day for each class of concrete; make cylinders from the next truck, " +
        "or record why none are needed (the project specification or the building official).",
    );
    expect(one.applied).toEqual({ value: 0, limit: 1, unit: "specimen sets" });
    expect(one.source).toEqual({ document: "ACI 318", edition: "19", clause: "§26.12.2.1", basis: "memory" });
    expect(one.governs).toBe(GOVERNS);
    const [three] = samplingFindings(input({ deliveries: [delivery(), delivery({ id: "d2" }), delivery({ id: "d3", status: "rejected" }), delivery({ id: "d4" })] }));
    // The rejected truck is not placed concrete: 3 of 4.
    expect(three.message).toMatch(/^Concrete from a mix specified by strength was placed \(3 trucks\)/);
  });

  it("a mix not specified by strength (f'c of 0) is not accepted on cylinders: nothing to say", () => {
    expect(samplingFindings(input({ placements: [placement({ mix: mix({ fcMPa: 0 }) })], deliveries: [delivery()] }))).toEqual([]);
    expect(samplingFindings(input({ placements: [placement({ mix: mix({ fcMPa: 0.1 }) })], deliveries: [delivery()] }))).toHaveLength(1);
  });

  it("a ticket with no volume is not concrete placed; another placement's truck is not this one's", () => {
    expect(samplingFindings(input({ deliveries: [delivery({ volumeM3: 0 })] }))).toEqual([]);
    expect(samplingFindings(input({ deliveries: [delivery({ volumeM3: 0.5 })] }))).toHaveLength(1);
    expect(samplingFindings(input({ deliveries: [delivery({ placementId: "p2" })] }))).toEqual([]);
  });

  it("one finding per placement without a set, each on its own placement", () => {
    const placements = [placement(), placement({ id: "p2", element: "Level 3 deck" })];
    const found = samplingFindings(input({ placements, deliveries: [delivery(), delivery({ id: "d2", placementId: "p2" })] }));
    expect(found.map((f) => [f.placementId, f.subject.id])).toEqual([
      ["p1", "p1"],
      ["p2", "p2"],
    ]);
  });
});
