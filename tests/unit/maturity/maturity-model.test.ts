import { describe, it, expect } from "vitest";

import { buildMaturityView, chartSeries, estimateText, settingsOf, targetText } from "@/lib/maturity/view";
import { targetMPaOf } from "@/components/maturity/maturity-summary";

const SENSOR = "00000000-0000-4000-8000-0000000000a1";
const start = Date.parse("2026-11-17T21:00:00Z");
const hourly = (hours: number, tempC: number) => Array.from({ length: hours + 1 }, (_, h) => [new Date(start + h * 3_600_000).toISOString(), tempC] as [string, number]);
// S = −45 + 20·log10(M) at 1, 3, 7, 14, 28 days standard-cured (23 °C × 24 h = 552 °C·h a day).
const breaks = [1, 3, 7, 14, 28].map((ageDays) => ({ ageDays, strengthMPa: -45 + 20 * Math.log10(552 * ageDays) }));
const base = {
  project: { unitSystem: "SI", timeZone: "America/Chicago" },
  placement: { id: "p", element: "Deck", leastDimensionMm: 250, plannedStart: new Date(start).toISOString() },
  mixCode: "M-1",
  sensors: [{ id: SENSOR, name: "T1", loggingIntervalMinutes: 60, endedAt: null }],
  breaks,
  now: new Date(start + 48 * 3_600_000),
};

describe("maturity model (field and office)", () => {
  it("uses the C1074 defaults when the project sets nothing [DOMAIN §6: T0 = 0 °C, Q = 5000 K]", () => {
    expect(settingsOf({})).toEqual({ method: "nurse-saul", datumC: 0, activationEnergyJPerMol: 41_570, referenceC: 20 });
    expect(settingsOf({ maturityMethod: "equivalent-age", maturityDatumC: -10 }).method).toBe("equivalent-age");
  });

  it("48 h at 20 °C → M = 960 °C·h → S = −45 + 20·log10 960 = 14.6 MPa [computed by hand]", () => {
    const view = buildMaturityView({ ...base, batches: [{ id: "b", sensorId: SENSOR, readings: hourly(48, 20) }], targetMPa: 15 });
    expect(estimateText(view, "SI")).toBe("14.6 MPa");
    // 15 MPa → M = 1000 °C·h: 40 °C·h more at 20 °C = 2 h after the last reading [computed by hand].
    expect(targetText(view, "America/Chicago")).toBe("Expected 2026-11-19 17:00 at T1, if it stays at its last reading");
  });

  it("says why there is no estimate without a calibrated mix, and never extrapolates the target", () => {
    const noMix = buildMaturityView({ ...base, mixCode: null, batches: [{ id: "b", sensorId: SENSOR, readings: hourly(4, 20) }], targetMPa: 15 });
    expect(estimateText(noMix, "SI")).toBe("The placement's mix has no calibration, so there is no strength estimate.");
    const high = buildMaturityView({ ...base, batches: [{ id: "b", sensorId: SENSOR, readings: hourly(4, 20) }], targetMPa: 60 });
    expect(targetText(high, "America/Chicago")).toContain("not extended beyond the calibration");
  });

  it("ignores deleted batches and thins a long record for the chart", () => {
    const view = buildMaturityView({
      ...base,
      batches: [{ id: "a", sensorId: SENSOR, readings: hourly(1000, 20) }, { id: "x", sensorId: SENSOR, readings: [[new Date(start).toISOString(), 60]], deletedAt: "2026-11-20T00:00:00Z" }],
      targetMPa: null,
    });
    expect(view.assessment.sensors[0].series).toHaveLength(1001);
    const points = chartSeries(view, 300)[0].points;
    expect(points.length).toBeLessThanOrEqual(301);
    expect(points.at(-1)!.maturity).toBeCloseTo(20_000, 6);
  });

  it("reads the typed target in the project's units: 3000 psi → 20.68 MPa [ASTM SI10: 1 psi = 6.894757 kPa]", () => {
    expect(targetMPaOf("3000", "IP")).toBeCloseTo(20.684, 3);
    expect(targetMPaOf("", "SI")).toBeNull();
    expect(targetMPaOf("abc", "SI")).toBeNull();
  });
});
