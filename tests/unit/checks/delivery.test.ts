// The rulebook's truck-ticket checks. Check values from ../shared DOMAIN §3 (ASTM C94 §10.7 discharge
// within 90 min; site water within 15 min of the first portion; revolutions only when ordered, C94-17a).
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/checks";
import { dischargeFinding, mixCodeFinding, revolutionsFinding, siteWaterFinding } from "@/lib/checks/delivery";
import { delivery, input, mix, project } from "./fixtures";

const t = (hhmm: string) => new Date(`2026-07-14T${hhmm}:00Z`);

describe("discharge time (ASTM C94 §10.7)", () => {
  it("batched 10:00, finished 11:30 → within; 11:31 → late [DOMAIN §3 check]", () => {
    expect(dischargeFinding(delivery({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:30") }), project())).toBeNull();
    const late = dischargeFinding(delivery({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:31") }), project())!;
    expect(late).toMatchObject({ rule: "discharge-time", severity: "warning", applied: { value: 91, limit: 90, unit: "min" } });
    expect(late.source).toEqual({ document: "ASTM C94", clause: "§10.7", basis: "published" });
    expect(late.message).toContain("without adding water");
  });

  it("a project limit of 60 min is applied and named as the project specification's", () => {
    const late = dischargeFinding(delivery({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:05") }), project({ dischargeLimitMinutes: 60 }))!;
    expect(late.source.basis).toBe("project");
    expect(late.message).toContain("60 min (project specification; ASTM C94 default 90 min)");
  });

  it("only the discharge start entered: no verdict; the elapsed time against the limit as information (issue item 6)", () => {
    const d = delivery({ batchedAt: t("10:00"), dischargeStartedAt: t("10:40"), dischargeFinishedAt: null });
    expect(dischargeFinding(d, project())).toBeNull();
    const running = dischargeFinding(d, project(), t("10:47"))!;
    expect(running).toMatchObject({ rule: "discharge-elapsed", severity: "info", title: "Discharging: 47 of 90 min since batching" });
    expect(dischargeFinding(d, project(), t("11:35"))!.message).toContain("has passed and the discharge is not finished");
    // Cylinders made, so the placement itself has nothing to say (lib/checks/sampling.ts).
    const sets = [{ id: "s1", placementId: "p1", setCode: "A", castAt: t("10:45"), cylinderDiameterMm: 150 }];
    expect(evaluate(input({ deliveries: [d], specimenSets: sets }), { now: t("10:47") }).map((f) => f.rule)).toEqual(["discharge-elapsed"]);
  });

  it("a night pour: batched 23:05, discharged 00:50 the next day is 105 min, late against 90 [computed: 55 + 50 min]", () => {
    const late = dischargeFinding(delivery({ batchedAt: new Date("2026-07-14T23:05:00-05:00"), dischargeFinishedAt: new Date("2026-07-15T00:50:00-05:00") }), project())!;
    expect(late).toMatchObject({ rule: "discharge-time", severity: "warning", applied: { value: 105, limit: 90, unit: "min" } });
    // Batched 23:05, finished 00:30: 85 min, in time.
    expect(dischargeFinding(delivery({ batchedAt: new Date("2026-07-14T23:05:00-05:00"), dischargeFinishedAt: new Date("2026-07-15T00:30:00-05:00") }), project())).toBeNull();
    // Still discharging at 00:50: 105 min elapsed since batching, not a negative figure.
    const running = dischargeFinding(delivery({ batchedAt: new Date("2026-07-14T23:05:00-05:00"), dischargeFinishedAt: null }), project(), new Date("2026-07-15T00:50:00-05:00"))!;
    expect(running.applied.value).toBe(105);
  });

  it("a rejected load is not judged", () => {
    expect(dischargeFinding(delivery({ status: "rejected", batchedAt: t("10:00"), dischargeFinishedAt: t("12:00") }), project())).toBeNull();
  });
});

describe("drum revolutions (ASTM C94-17a §6.1.9: only when the order states a limit)", () => {
  it("off by default; over an ordered 300 is a warning", () => {
    expect(revolutionsFinding(delivery({ revolutions: 320 }), project())).toBeNull();
    expect(revolutionsFinding(delivery({ revolutions: 300 }), project({ revolutionLimit: 300 }))).toBeNull();
    expect(revolutionsFinding(delivery({ revolutions: 301 }), project({ revolutionLimit: 300 }))?.severity).toBe("warning");
  });
});

describe("water added at site (ASTM C94, current wording)", () => {
  const allowance = mix({ siteWaterAllowedLPerM3: 10 }); // 80 L for an 8 m³ load
  it("within the allowance and the window: a caution that records it", () => {
    const f = siteWaterFinding(delivery({ waterAddedL: 60, waterFirstAt: t("10:40"), waterLastAt: t("10:55") }), allowance, project())!;
    expect(f.severity).toBe("caution");
    expect(f.message).toContain("one addition, all portions within 15 min of the first, then 30 drum revolutions");
  });
  it("first 10:40, last 10:56: outside the 15-min window [DOMAIN §3 check]; over the allowance: a warning", () => {
    expect(siteWaterFinding(delivery({ waterAddedL: 60, waterFirstAt: t("10:40"), waterLastAt: t("10:56") }), allowance, project())?.severity).toBe("warning");
    const over = siteWaterFinding(delivery({ waterAddedL: 90, waterFirstAt: t("10:40"), waterLastAt: t("10:45") }), allowance, project())!;
    expect(over.severity).toBe("warning");
    expect(over.applied).toEqual({ value: 90, limit: 80, unit: "L" });
  });
  it("inch-pound: values in gallons", () => {
    const f = siteWaterFinding(delivery({ waterAddedL: 37.85411784 }), allowance, project({ unitSystem: "IP" }))!;
    expect(f.applied.unit).toBe("gal");
    expect(f.applied.value).toBeCloseTo(10, 9);
  });
});

describe("the mix code on the ticket (ASTM C94 §14 delivery ticket; checked against the placement's mix [common practice])", () => {
  const planned = mix({ code: "LC-4000-A" });
  it("the placement's mix, however it is written, is no finding; another mix is a warning naming both", () => {
    expect(mixCodeFinding(delivery({ mixCode: "LC-4000-A" }), planned)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "lc 4000a" }), planned)).toBeNull();
    const wrong = mixCodeFinding(delivery({ mixCode: "LC-5000-B" }), planned)!;
    expect(wrong).toMatchObject({ rule: "mix-code", severity: "warning", subject: { type: "delivery", id: "d1" } });
    expect(wrong.title).toBe("Wrong mix on the ticket: ticket BR-1042 (truck 31) says LC-5000-B, the placement's mix is LC-4000-A");
    expect(evaluate(input({ deliveries: [delivery({ mixCode: "LC-5000-B" })] })).map((f) => f.rule)).toContain("mix-code");
  });
  it("no code entered, no mix planned, or a rejected load: nothing to judge", () => {
    expect(mixCodeFinding(delivery({ mixCode: null }), planned)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "LC-5000-B" }), null)).toBeNull();
    expect(mixCodeFinding(delivery({ mixCode: "LC-5000-B", status: "rejected" }), planned)).toBeNull();
  });
});
