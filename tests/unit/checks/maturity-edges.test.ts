// Edges of the rulebook's maturity findings: the protection window's ends, the section minimum itself,
// which cold reading is cited, how a hole in a record is measured and worded, and who confirms an
// estimate. Sources: ACI 306R minimum by section (13 °C under 300 mm, secondary quotations of ACI 306R
// Line 1 / ACI 306.1 Table 3.1, ../shared DOMAIN §2) and protection period [memory]; ASTM C1074
// (continuous record; estimate confirmed by other tests before form removal or loading) [memory].
import { describe, expect, it } from "vitest";
import { DEFAULT_MATURITY_SETTINGS, assessPlacementMaturity, calibrateFromBreaks } from "@/lib/concrete";
import { maturityColdFindings, maturityGapFindings, maturityTargetFindings, type CheckSensor, type CheckSensorReading } from "@/lib/checks/maturity";
import { placement as placementOf, project as projectOf } from "./fixtures";

const HOUR = 3_600_000;
const start = new Date("2026-11-02T13:00:00Z"); // 07:00 in Chicago
const project = projectOf();
const placement = placementOf({ plannedStart: start, leastDimensionMm: 250, mix: null });
const sensor = (id: string, loggingIntervalMinutes: number | null = 60): CheckSensor => ({ id, placementId: "p1", name: id.toUpperCase(), loggingIntervalMinutes, endedAt: null });
const at = (hours: number) => new Date(start.getTime() + hours * HOUR);
const r = (sensorId: string, hours: number, tempC: number): CheckSensorReading => ({ sensorId, at: at(hours), tempC });

describe("maturity-cold: the protection window and the 13 °C minimum (ACI 306R)", () => {
  it("a reading at exactly 13 °C is not below it; readings at the very start and the very end of the window count", () => {
    expect(maturityColdFindings(project, placement, [sensor("s1")], [r("s1", 0, 13)])).toEqual([]);
    expect(maturityColdFindings(project, placement, [sensor("s1")], [r("s1", 0, 12.9)])).toHaveLength(1);
    expect(maturityColdFindings(project, placement, [sensor("s1")], [r("s1", 72, 12.9)], 3)).toHaveLength(1);
    expect(maturityColdFindings(project, placement, [sensor("s1")], [r("s1", -1, 5), r("s1", 73, 5)], 3)).toEqual([]);
  });

  it("cites the lowest reading (the earliest of equals), counts the cold readings, and says what to do", () => {
    const readings = [r("s1", 1, 11), r("s1", 3, 9), r("s1", 2, 9), r("s1", 4, 12), r("s2", 2, 1)];
    const [f] = maturityColdFindings(project, placement, [sensor("s1")], readings);
    expect(f.at).toBe(at(2).toISOString());
    expect(f.message).toBe(
      "4 readings of this sensor during the protection period fell below the minimum concrete temperature for this section (lowest at 2026-11-02 09:00). " +
        "Check the enclosure and heaters, and tell the engineer of record; early freezing can harm the concrete.",
    );
    expect(f.source).toEqual({ document: "ACI 306R", basis: "memory" });
    const [one] = maturityColdFindings(project, placement, [sensor("s1")], [r("s1", 5, 12)]);
    expect(one.message).toMatch(/^1 reading of this sensor/);
  });
});

describe("maturity-gap: a continuous record (ASTM C1074)", () => {
  it("readings arrive in any order and other sensors' readings do not fill the hole; a 2-hour hole reads as hours", () => {
    const readings = [r("s1", 4, 15), r("s1", 0, 15), r("s1", 2, 15), r("s1", 1, 15), r("s2", 3, 15)];
    const found = maturityGapFindings(project, placement, [sensor("s1")], readings, at(4.5));
    expect(found.map((f) => f.title)).toEqual(["Sensor S1 has a 2.0 h gap in its record from 2026-11-02 09:00"]);
    expect(found[0].message).toBe(
      "The logger reads every 60 min. Across the gap the maturity is computed from the readings either side, which may miss a cold spell; download the logger again if it holds the missing readings.",
    );
    expect(found[0].source).toEqual({ document: "ASTM C1074", basis: "memory" });
    expect(found[0]).toMatchObject({ rule: "maturity-gap", severity: "caution", subject: { type: "sensor", id: "s1" }, placementId: "p1" });
  });

  it("a silent sensor: under two hours in minutes, from two hours in hours, with what to check", () => {
    const record = [r("s1", 0, 15), r("s1", 1, 15)];
    expect(maturityGapFindings(project, placement, [sensor("s1")], record, at(3))[0].title).toBe("Sensor S1 has sent no reading for 2.0 h");
    const [f] = maturityGapFindings(project, placement, [sensor("s1")], record, at(2.6));
    expect(f.title).toBe("Sensor S1 has sent no reading for 96 min");
    expect(f.message).toBe(
      "The logger reads every 60 min. Check the sensor and its logger; until readings resume the maturity, the estimate and the time to target stop at the last reading.",
    );
  });

  it("the logger's stated interval wins over the record's spacing; without either there is nothing to judge", () => {
    const hourly = [0, 1, 2].map((h) => r("s1", h, 15));
    expect(maturityGapFindings(project, placement, [sensor("s1", 30)], hourly, at(2))).toHaveLength(2);
    expect(maturityGapFindings(project, placement, [sensor("s1", null)], hourly, at(2))).toEqual([]);
    expect(maturityGapFindings(project, placement, [sensor("s1", null)], [r("s1", 0, 15)], at(9))).toEqual([]);
  });
});

describe("maturity-target: only with a target, and the estimate must be confirmed (ASTM C1074 [memory])", () => {
  const calibration = calibrateFromBreaks([1, 3, 7, 14, 28].map((ageDays) => ({ ageDays, strengthMPa: -45 + 20 * Math.log10(552 * ageDays) })));
  const readings = Array.from({ length: 121 }, (_, h) => ({ at: at(h), tempC: 10 }));
  const reached = assessPlacementMaturity({ sensors: [{ id: "cold", name: "Cold", readings }], settings: DEFAULT_MATURITY_SETTINGS, calibration, targetMPa: 15 });

  it("names the placement and who decides", () => {
    const [f] = maturityTargetFindings(project, placement, reached, 15);
    expect(f).toMatchObject({ rule: "maturity-target", severity: "info", subject: { type: "sensor", id: "cold" } });
    expect(f.message).toBe(
      "By the maturity method, every sensor of Level 2 deck had reached the maturity of 15.0 MPa on the mix's calibration by 2026-11-06 11:00. " +
        "ASTM C1074 asks that the estimate be confirmed by other tests (field-cured cylinders, cores or in-place tests) before form removal, post-tensioning or loading; the project specification, the formwork engineer and the engineer of record decide.",
    );
    expect(f.source).toEqual({ document: "ASTM C1074", basis: "memory" });
    expect(f.applied).toEqual({ value: 15, limit: 15, unit: "MPa" });
  });

  it("no target set: no finding", () => {
    expect(maturityTargetFindings(project, placement, reached, null)).toEqual([]);
  });
});
