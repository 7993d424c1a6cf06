import { describe, it, expect } from "vitest";

import { DEFAULT_MATURITY_SETTINGS, assessPlacementMaturity, calibrateFromBreaks } from "@/lib/concrete";
import { localTimeText, maturityColdFindings, maturityGapFindings, maturityTargetFindings, type CheckSensor, type CheckSensorReading } from "@/lib/checks/maturity";
import { GOVERNS, type CheckPlacement, type CheckProject } from "@/lib/checks/types";

const HOUR = 3_600_000;
const start = new Date("2026-11-02T13:00:00Z"); // 07:00 in Chicago (CST, UTC−6)
const project: CheckProject = {
  unitSystem: "SI",
  timeZone: "America/Chicago",
  dischargeLimitMinutes: 90,
  revolutionLimit: null,
  evaporationHighKgM2H: null,
  maxConcreteTempC: 32,
  coldWeatherDefinition: "aci306r-current",
};
const placement: CheckPlacement = { id: "p1", element: "Level 2 deck", leastDimensionMm: 250, plannedVolumeM3: 80, plannedStart: start, mix: null };
const sensor = (id: string, endedAt: Date | null = null): CheckSensor => ({ id, placementId: "p1", name: id.toUpperCase(), loggingIntervalMinutes: 60, endedAt });
const hourly = (sensorId: string, hours: number, tempC: (h: number) => number): CheckSensorReading[] =>
  Array.from({ length: hours + 1 }, (_, h) => ({ sensorId, at: new Date(start.getTime() + h * HOUR), tempC: tempC(h) }));

describe("maturity-cold (ACI 306R minimum for the section, called from lib/concrete)", () => {
  it("a 250 mm deck: 13 °C minimum (ACI 306R SI table, < 300 mm) [memory]; one finding per sensor at its lowest reading", () => {
    const readings = hourly("s1", 30, (h) => (h === 20 ? 9.5 : h === 21 ? 11 : 15));
    const found = maturityColdFindings(project, placement, [sensor("s1"), sensor("s2")], [...readings, ...hourly("s2", 30, () => 16)]);
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({
      rule: "maturity-cold",
      severity: "warning",
      subject: { type: "sensor", id: "s1" },
      placementId: "p1",
      at: new Date(start.getTime() + 20 * HOUR).toISOString(),
      applied: { value: 9.5, limit: 13, unit: "°C" },
      governs: GOVERNS,
    });
    expect(found[0].title).toBe("Sensor S1 read 9.5 °C, below the 13 °C minimum during protection");
    expect(found[0].message).toContain("2 readings");
  });

  it("inch-pound project: 55 °F for a section under 12 in (ACI 306R IP table) [memory], judged in °F", () => {
    const readings = hourly("s1", 5, () => 12); // 12 °C = 53.6 °F
    const found = maturityColdFindings({ ...project, unitSystem: "IP" }, placement, [sensor("s1")], readings);
    expect(found[0].applied.unit).toBe("°F");
    expect(found[0].applied.limit).toBeCloseTo(55, 9);
    expect(found[0].applied.value).toBeCloseTo(53.6, 9); // 12 × 9/5 + 32 [computed by hand]
  });

  it("ignores readings after the protection period and placements without a least dimension", () => {
    const late = hourly("s1", 4 * 24, (h) => (h > 3 * 24 + 1 ? 2 : 15));
    expect(maturityColdFindings(project, placement, [sensor("s1")], late)).toEqual([]); // 3 days: ACI 306R, exposed, no load
    expect(maturityColdFindings(project, placement, [sensor("s1")], late, 4)).toHaveLength(1);
    expect(maturityColdFindings(project, { ...placement, leastDimensionMm: null }, [sensor("s1")], hourly("s1", 3, () => 1))).toEqual([]);
  });
});

describe("maturity-gap", () => {
  it("a 5-hour hole in an hourly record and a sensor that stopped", () => {
    const readings = hourly("s1", 10, () => 15).filter((r) => {
      const h = (r.at.getTime() - start.getTime()) / HOUR;
      return h <= 2 || h >= 7;
    });
    const found = maturityGapFindings(project, placement, [sensor("s1")], readings, new Date(start.getTime() + 14 * HOUR));
    expect(found.map((f) => f.title)).toEqual([
      "Sensor S1 has a 5.0 h gap in its record from 2026-11-02 09:00",
      "Sensor S1 has sent no reading for 4.0 h",
    ]);
    expect(found[0].applied).toEqual({ value: 300, limit: 60, unit: "min" });
    expect(found.every((f) => f.rule === "maturity-gap" && f.severity === "caution")).toBe(true);
  });

  it("a sensor whose monitoring ended is not 'stopped'", () => {
    const found = maturityGapFindings(project, placement, [sensor("s1", start)], hourly("s1", 3, () => 15), new Date(start.getTime() + 30 * HOUR));
    expect(found).toEqual([]);
  });
});

describe("maturity-target (ASTM C1074 estimate at the coldest sensor)", () => {
  // Synthetic calibration S = −45 + 20·log10(M) at 1, 3, 7, 14, 28 days standard-cured.
  const calibration = calibrateFromBreaks([1, 3, 7, 14, 28].map((ageDays) => ({ ageDays, strengthMPa: -45 + 20 * Math.log10(552 * ageDays) })));
  const records = [
    { id: "warm", name: "Warm", readings: hourly("warm", 72, () => 20).map(({ at, tempC }) => ({ at, tempC })) },
    { id: "cold", name: "Cold", readings: hourly("cold", 72, () => 10).map(({ at, tempC }) => ({ at, tempC })) },
  ];

  it("reached when the cold sensor reaches the target maturity: 20 MPa → M = 10^3.25 = 1778.3 °C·h, at 10 °C → 177.83 h (predicted) [computed by hand]", () => {
    const a = assessPlacementMaturity({ sensors: records, settings: DEFAULT_MATURITY_SETTINGS, calibration, targetMPa: 20 });
    expect(a.coldest?.id).toBe("cold");
    expect(a.target.status).toBe("predicted");
    expect(a.target.status === "predicted" && (a.target.at.getTime() - start.getTime()) / HOUR).toBeCloseTo(177.83, 2);
    expect(maturityTargetFindings(project, placement, a, 20)).toEqual([]);
  });

  it("15 MPa → M = 10^3 = 1000 °C·h: the cold sensor at 10 °C reaches it at 100 h, after the warm one at 50 h [computed by hand]", () => {
    const longer = records.map((r) => ({ ...r, readings: hourly(r.id, 120, () => (r.id === "warm" ? 20 : 10)).map(({ at, tempC }) => ({ at, tempC })) }));
    const a = assessPlacementMaturity({ sensors: longer, settings: DEFAULT_MATURITY_SETTINGS, calibration, targetMPa: 15 });
    const [finding] = maturityTargetFindings(project, placement, a, 15);
    const at = new Date(start.getTime() + 100 * HOUR);
    expect(finding).toMatchObject({ rule: "maturity-target", severity: "info", subject: { type: "sensor", id: "cold" }, at: at.toISOString() });
    expect(finding.title).toBe(`Target strength 15.0 MPa estimated as reached at ${localTimeText(at, "America/Chicago")}`);
    expect(localTimeText(at, "America/Chicago")).toBe("2026-11-06 11:00"); // 13:00Z + 100 h = 17:00Z on the 6th, CST [computed by hand]
    expect(finding.message).toContain("confirmed by other tests");
  });

  it("a target above the calibration is refused, never extrapolated", () => {
    const a = assessPlacementMaturity({ sensors: records, settings: DEFAULT_MATURITY_SETTINGS, calibration, targetMPa: 50 });
    expect(a.target.status).toBe("refused");
    expect(maturityTargetFindings(project, placement, a, 50)).toEqual([]);
  });
});
