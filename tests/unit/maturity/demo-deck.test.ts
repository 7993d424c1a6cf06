import { describe, it, expect } from "vitest";

import { buildMaturityView, estimateText, targetText } from "@/lib/maturity/view";
import { psiToMPa } from "@/lib/concrete/units";
import { DEMO_IDS } from "@/scripts/seed/ids";
import { demoRecords } from "@/scripts/seed/records-data";

// The demo's Level 2 deck must show what the feature is for: a calibrated mix, an estimate and a target.
describe("demo: Larkspur Commons, Level 2 deck", () => {
  const records = new Map(demoRecords().reduce<[string, Record<string, unknown>[]][]>((acc, [type, rows]) => {
    const found = acc.find(([t]) => t === type);
    const values = rows.map((r) => r.values);
    if (found) found[1].push(...values);
    else acc.push([type, values]);
    return acc;
  }, []));
  const deck = records.get("placements")!.find((p) => p.element === "Level 2 deck")!;
  const sensors = records.get("temperature-sensors")!.filter((s) => s.placementId === deck.id);
  const sets = records.get("specimen-sets")!.filter((s) => s.placementId === deck.id);
  const breaks = records.get("breaks")!
    .filter((b) => sets.some((s) => s.id === b.specimenSetId))
    // ASTM C39 strength of the seeded load on a 4 in cylinder (the server computes it from the load).
    .map((b) => ({ ageDays: b.ageDays as number, strengthMPa: ((b.loadKN as number) * 1000) / ((Math.PI * (b.diameterMm as number) ** 2) / 4) }));

  const view = buildMaturityView({
    project: { unitSystem: "IP", timeZone: "America/Chicago", id: DEMO_IDS.projects.larkspur },
    placement: { ...deck, id: deck.id as string, plannedStart: (deck.plannedStart as Date).toISOString() },
    mixCode: "LC-5000-D",
    sensors,
    batches: records.get("sensor-readings")!,
    breaks,
    targetMPa: psiToMPa(3000),
    now: new Date("2026-11-27T18:00:00Z"),
  });

  it("two sensors over four days and a mix calibrated at four ages", () => {
    expect(sensors).toHaveLength(2);
    expect(view.calibration?.ok && view.calibration.points.map((p) => p.ageDays)).toEqual([1, 2, 3, 7]);
    expect(view.calibration?.ok && view.calibration.fit.rSquared).toBeGreaterThan(0.95);
    const spanH = (s: { series: { at: Date }[] }) => (s.series.at(-1)!.at.getTime() - s.series[0].at.getTime()) / 3_600_000;
    expect(view.assessment.sensors.map(spanH)).toEqual([96, 96]);
  });

  // The edge is just short of the 3000 psi stripping strength when the record ends, so a reading
  // entered on the phone moves it across (the end-to-end test does exactly that).
  it("an estimate at the edge sensor just under the target, a predicted time, and the edge logger's gap", () => {
    expect(view.assessment.coldest?.name).toBe("T2");
    console.log("estimate:", estimateText(view, "IP"), "| target:", targetText(view, "America/Chicago"));
    expect(view.assessment.target.status).toBe("predicted");
    expect(view.assessment.estimate?.status === "estimate" && view.assessment.estimate.strengthMPa).toBeLessThan(psiToMPa(3000));
    expect(view.findings.map((f) => f.rule)).toEqual(["maturity-gap"]);
  });
});
