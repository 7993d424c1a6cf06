// Edges of the rulebook's truck-ticket checks: exactly at the limits, which time a finding is dated
// by, and the wording that names the rule and says who decides. Sources as in ../shared DOMAIN §3:
// ASTM C94 §10.7 (discharge within 90 min of batching; the purchaser may waive it when the concrete
// can still be placed without adding water), C94-17a §6.1.9 (a revolution limit only when the order
// states one), C94 current wording on water added at the site (one addition, all portions within
// 15 min of the first, then 30 revolutions at mixing speed, within the mix design's maximum water).
import { describe, expect, it } from "vitest";
import { dischargeFinding, revolutionsFinding, siteWaterFinding, ticketName } from "@/lib/checks/delivery";
import { delivery, mix, project } from "./fixtures";

const t = (hhmm: string) => new Date(`2026-07-14T${hhmm}:00Z`);
const C94_WATER =
  "ASTM C94 allows one addition, all portions within 15 min of the first, then 30 drum revolutions at mixing speed, never beyond the mix design's maximum water.";

describe("discharge time (ASTM C94 §10.7)", () => {
  it("a late truck is named by ticket and truck, and the message says who may accept it", () => {
    const late = dischargeFinding(delivery({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:31") }), project())!;
    expect(late.title).toBe("Late truck: ticket BR-1042 (truck 31), 91 min from batching");
    expect(late.message).toBe(
      "Discharge finished 91 min after batching, over the 90 min (ASTM C94) limit. " +
        "The purchaser may accept the load only when it can still be placed without adding water; record who decided.",
    );
    expect(ticketName({ ticketNumber: "BR-1042", truck: "" })).toBe("ticket BR-1042");
  });

  it("a project limit is the project specification's", () => {
    const late = dischargeFinding(delivery({ batchedAt: t("10:00"), dischargeFinishedAt: t("11:05") }), project({ dischargeLimitMinutes: 60 }))!;
    expect(late.source).toEqual({ document: "Project specification", basis: "project" });
  });

  it("still discharging at exactly 90 min: the limit has not passed; at 91 min it has", () => {
    const d = delivery({ batchedAt: t("10:00"), dischargeFinishedAt: null });
    expect(dischargeFinding(d, project(), t("11:30"))!.message).toBe(
      "Discharge must be complete within 90 min (ASTM C94) of batching. Enter the time discharge ends to check it.",
    );
    expect(dischargeFinding(d, project(), t("11:31"))!.message).toBe(
      "The 90 min (ASTM C94) limit has passed and the discharge is not finished. Only the purchaser can waive the limit, when the concrete can still be placed without adding water.",
    );
  });

  it("discharge finished before batching is refused elsewhere and not judged here", () => {
    expect(dischargeFinding(delivery({ batchedAt: t("12:00"), dischargeFinishedAt: t("10:00") }), project())).toBeNull();
  });
});

describe("drum revolutions (ASTM C94-17a §6.1.9)", () => {
  it("over an ordered 300: named, dated by the end of discharge, citing the clause", () => {
    const f = revolutionsFinding(delivery({ revolutions: 301 }), project({ revolutionLimit: 300 }))!;
    expect(f.title).toBe("Drum revolutions over the limit: ticket BR-1042 (truck 31), 301 revolutions");
    expect(f.message).toBe("301 revolutions; the order allows 300. ASTM C94 applies a revolution limit only when the order states one.");
    expect(f.applied).toEqual({ value: 301, limit: 300, unit: "revolutions" });
    expect(f).toMatchObject({ rule: "revolutions", subject: { type: "delivery", id: "d1" }, placementId: "p1" });
    expect(f.source).toEqual({ document: "ASTM C94", edition: "17a", clause: "§6.1.9", basis: "published" });
    expect(f.at).toBe(t("16:20").toISOString());
    expect(revolutionsFinding(delivery({ revolutions: 301, dischargeFinishedAt: null }), project({ revolutionLimit: 300 }))!.at).toBe(t("15:35").toISOString());
  });

  it("a rejected load is not judged", () => {
    expect(revolutionsFinding(delivery({ revolutions: 400, status: "rejected" }), project({ revolutionLimit: 300 }))).toBeNull();
  });
});

describe("water added at the site (ASTM C94)", () => {
  const allowance = mix({ siteWaterAllowedLPerM3: 10 }); // 80 L for an 8 m³ load

  it("exactly the allowance, in one 15-min window: a caution that records it, with the rule", () => {
    const f = siteWaterFinding(delivery({ waterAddedL: 80, waterFirstAt: t("10:40"), waterLastAt: t("10:55") }), allowance, project())!;
    expect(f.severity).toBe("caution");
    expect(f.title).toBe("Water added at site: ticket BR-1042 (truck 31), 80 L");
    expect(f).toMatchObject({ rule: "site-water", subject: { type: "delivery", id: "d1" }, placementId: "p1" });
    expect(f.message).toBe(`Within the 80 L the mix design allows for this load. ${C94_WATER}`);
    expect(f.source).toEqual({ document: "ASTM C94", clause: "water added at the job site", basis: "published" });
    expect(f.at).toBe(t("10:55").toISOString());
  });

  it("over the allowance and spread over 16 min: a warning naming both problems", () => {
    const f = siteWaterFinding(delivery({ waterAddedL: 90, waterFirstAt: t("10:40"), waterLastAt: t("10:56") }), allowance, project())!;
    expect(f.title).toBe("Water over the allowance or window: ticket BR-1042 (truck 31), 90 L");
    expect(f.message).toBe(
      `Water added at site over the 80 L the mix design allows for this load; portions spread over 16 min (all must be within 15 min of the first). ${C94_WATER}`,
    );
  });

  it("no mix on record: nothing is allowed", () => {
    const f = siteWaterFinding(delivery({ waterAddedL: 10 }), null, project())!;
    expect(f.severity).toBe("warning");
    expect(f.applied.limit).toBe(0);
  });

  it("only one portion time known, or times out of order: no window verdict; dated by the latest time known", () => {
    const onlyFirst = siteWaterFinding(delivery({ waterAddedL: 60, waterFirstAt: t("10:40") }), allowance, project())!;
    expect(onlyFirst.severity).toBe("caution");
    expect(onlyFirst.at).toBe(t("10:40").toISOString());
    const onlyLast = siteWaterFinding(delivery({ waterAddedL: 60, waterLastAt: t("10:58") }), allowance, project())!;
    expect(onlyLast.severity).toBe("caution");
    expect(onlyLast.at).toBe(t("10:58").toISOString());
    expect(siteWaterFinding(delivery({ waterAddedL: 60, waterFirstAt: t("11:40"), waterLastAt: t("10:40") }), allowance, project())!.severity).toBe("caution");
    expect(siteWaterFinding(delivery({ waterAddedL: 60 }), allowance, project())!.at).toBe(t("15:35").toISOString());
  });
});
