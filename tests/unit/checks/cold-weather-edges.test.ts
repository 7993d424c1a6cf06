// Edges of the rulebook's cold-weather checks: which reading of the day is judged, which placements'
// minimums are quoted, the wording that names the rule and tells the crew what to do. Sources as in
// ../shared DOMAIN §2: ACI 306R current definition (4 °C / 40 °F), ACI 306.1-90 (below 40 °F for more
// than 3 successive days, not when above 50 °F for more than half of a day [src: ACI 306R-88 as quoted
// in the AASHTO glossary]; SI 5 °C [memory]), the minimum by least section dimension (secondary
// quotations of ACI 306R Line 1 / ACI 306.1 Table 3.1), PCA (about 3.5 MPa / 500 psi before freezing).
import { describe, expect, it } from "vitest";
import { coldWeatherCautions, coldWeatherFindings, curingFinding, curingMinimumC } from "@/lib/checks/cold-weather";
import { fToC, input, placement, project, weather } from "./fixtures";

const p1990 = (unitSystem: "SI" | "IP") => project({ coldWeatherDefinition: "aci306-1990", unitSystem });
// Chicago is UTC−6 in January: hour h UTC is h − 6 local, same date for 06:00–23:00 UTC.
const at = (date: string, hourUtc: number, minute = 0) => new Date(Date.UTC(2026, 0, Number(date.slice(8)), hourUtc, minute));
const reading = (date: string, hourUtc: number, airTempC: number) =>
  weather({ id: `${date}-${hourUtc}`, placementId: null, observedAt: at(date, hourUtc), airTempC, concreteTempC: null });
// A day read every hour from 06:00 to 23:00 UTC (00:00–17:00 local), all at `tempC` but one cold hour.
const hourly = (date: string, tempC: number, lowC: number) =>
  Array.from({ length: 18 }, (_, i) => reading(date, 6 + i, i === 0 ? lowC : tempC));
const dates = (n: number) => Array.from({ length: n }, (_, i) => `2026-01-${String(10 + i).padStart(2, "0")}`);

describe("current ACI 306R definition: the day's lowest reading is judged", () => {
  it("of 5, 2, 2 and 8 °C the first 2 °C reading is the one cited (at, title, applied)", () => {
    const day = [reading("2026-01-12", 16, 5), reading("2026-01-12", 18, 2), reading("2026-01-12", 20, 2), reading("2026-01-12", 22, 8)];
    const [f] = coldWeatherFindings(input({ placements: [], weather: day }));
    expect(f.at).toBe(at("2026-01-12", 18).toISOString());
    expect(f.title).toBe("Cold weather: protect the fresh concrete (air down to 2 °C)");
    expect(f.applied).toEqual({ value: 2, limit: 4, unit: "°C" });
  });

  it("names the rule, tells what to do and carries every cold-weather caution [src: ACI 306R; PCA]", () => {
    const [f] = coldWeatherFindings(input({ placements: [], weather: [reading("2026-01-12", 18, 3)] }));
    expect(f.message).toBe(
      "Air temperature fell to 3.0 °C, at or below 4 °C. " +
        "ACI 306R: cold weather when the air has fallen to, or is expected to fall below, 4 °C. " +
        coldWeatherCautions("SI").join(" "),
    );
    expect(coldWeatherCautions("SI")).toEqual([
      "Vent combustion heaters in enclosures to the outside: their exhaust carries carbon monoxide.",
      "Protect the fresh concrete from freezing until it reaches about 3.5 MPa (PCA, Design and Control of Concrete Mixtures).",
      "Do not place concrete on frozen ground or against ice on forms or reinforcement.",
    ]);
    expect(coldWeatherCautions("IP")[1]).toContain("about 500 psi (PCA");
  });

  it("quotes the minimums of that day's placements only, and skips those without a usable section size", () => {
    const onDay = (overrides: Parameters<typeof placement>[0]) => placement({ plannedStart: at("2026-01-12", 15), ...overrides });
    const placements = [
      onDay({ id: "deck", element: "Level 2 deck", leastDimensionMm: 250 }),
      onDay({ id: "wall", element: "Wall W3", leastDimensionMm: 300 }),
      onDay({ id: "none", element: "Stair", leastDimensionMm: null }),
      onDay({ id: "zero", element: "Pad", leastDimensionMm: 0 }),
      placement({ id: "other", element: "Footing F1", leastDimensionMm: 250, plannedStart: at("2026-01-13", 15) }),
    ];
    const [f] = coldWeatherFindings(input({ placements, weather: [reading("2026-01-12", 18, 3)] }));
    expect(f.message).toContain("4 °C. Keep Level 2 deck at or above 13 °C; Wall W3 at or above 10 °C (ACI 306R minimum by least section dimension). Vent");
    expect(f.message).not.toContain("Footing F1");
  });
});

describe("ACI 306.1-90 definition", () => {
  const days = (list: string[], lowC: number, highC: number) => list.flatMap((d) => [reading(d, 12, lowC), reading(d, 21, highC)]);

  it("SI: the finding cites the definition [memory: 5 °C], the mean judged and the run of four days that decides it", () => {
    const findings = coldWeatherFindings(input({ placements: [], project: p1990("SI"), weather: days(dates(5), 0, 9) }));
    expect(findings.map((f) => f.subject.id)).toEqual(["2026-01-13", "2026-01-14"]);
    // Four days decide it: the fifth day's finding still speaks of four.
    for (const f of findings) {
      expect(f.message).toContain(
        "Average daily temperature has been below 5 °C for 4 successive days (more than 3). ACI 306.1-90: cold weather when the average daily temperature is below 5 °C for more than 3 successive days.",
      );
      expect(f.applied).toEqual({ value: 4.5, limit: 5, unit: "°C" });
    }
  });

  it("inch-pound: 40 °F is published, so the source is not marked as memory [src: ACI 306.1-90]", () => {
    const [f] = coldWeatherFindings(input({ placements: [], project: p1990("IP"), weather: days(dates(4), fToC(30), fToC(48)) }));
    expect(f.source).toEqual({ document: "ACI 306.1", edition: "90", basis: "published" });
    expect(f.applied).toEqual({ value: 39, limit: 40, unit: "°F" });
  });

  it("SI: a day at 3 °C around the clock is cold, not warm (hours above 10 °C, not above some other value)", () => {
    const cold = dates(4).flatMap((d) => hourly(d, 3, 0));
    expect(coldWeatherFindings(input({ placements: [], project: p1990("SI"), weather: cold })).map((f) => f.subject.id)).toEqual(["2026-01-13"]);
  });

  it("inch-pound: 13 h above 50 °F on the fourth day ends the run; 13 h at 45 °F does not", () => {
    const base = dates(3).flatMap((d) => days([d], fToC(25), fToC(45)));
    // Low 20 °F at 00:00 local, then 51 °F (or 45 °F) to 17:00: mean (51 + 20) / 2 = 35.5 °F, below 40 °F.
    const warm = [...base, ...hourly("2026-01-13", fToC(51), fToC(20))];
    expect(coldWeatherFindings(input({ placements: [], project: p1990("IP"), weather: warm }))).toEqual([]);
    const mild = [...base, ...hourly("2026-01-13", fToC(45), fToC(20))];
    expect(coldWeatherFindings(input({ placements: [], project: p1990("IP"), weather: mild })).map((f) => f.subject.id)).toEqual(["2026-01-13"]);
  });
});

describe("curing and protection readings", () => {
  const curing = (tempC: number) => ({ id: "c1", placementId: "p1", readAt: new Date("2026-01-12T12:00:00Z"), tempC });

  it("says what the rule is and what to do, without the placing-only caution [src: ACI 306R; PCA]", () => {
    const f = curingFinding(curing(8), placement(), project())!;
    expect(f.message).toBe(
      "ACI 306R: keep concrete with this least dimension at or above 13 °C while it is protected. Raise the heat or the insulation and read again. " +
        coldWeatherCautions("SI").slice(0, 2).join(" "),
    );
    expect(f.source).toEqual({ document: "ACI 306R", clause: "minimum temperature by least section dimension (ACI 306.1 Table 3.1)", basis: "published" });
    expect(f.placementId).toBe("p1");
  });

  it("no placement, or no usable section size: no verdict", () => {
    expect(curingFinding(curing(0), undefined, project())).toBeNull();
    expect(curingFinding(curing(0), placement({ leastDimensionMm: 0 }), project())).toBeNull();
  });

  it("the minimum shown as an input hint: 13 °C / 55 °F under 300 mm (12 in), 10 °C from 300 mm; none without a size", () => {
    expect(curingMinimumC({ leastDimensionMm: 250 }, "SI")).toBe(13);
    expect(curingMinimumC({ leastDimensionMm: 300 }, "SI")).toBe(10);
    expect(curingMinimumC({ leastDimensionMm: 250 }, "IP")).toBeCloseTo(fToC(55), 9);
    expect(curingMinimumC({ leastDimensionMm: null }, "SI")).toBeNull();
    expect(curingMinimumC({ leastDimensionMm: 0 }, "SI")).toBeNull();
  });
});
