// The rulebook's cold-weather checks: the project's definition, in its own unit system, and the
// protection minimum by section size. Sources: ACI 306R (current definition and the minimum-temperature
// table, via secondary quotations of Line 1 / ACI 306.1 Table 3.1), ACI 306.1-90 and ACI 306R-88 (older
// definition, SI values from memory), PCA (freezing limit).
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/checks";
import { coldWeatherFindings, curingFinding } from "@/lib/checks/cold-weather";
import { fToC, input, placement, project, weather } from "./fixtures";

const ip = project({ unitSystem: "IP" });
// Chicago is UTC−6 in January: 12:00 UTC is 06:00 local on the same date.
const at = (date: string, hourUtc: number) => new Date(`${date}T${String(hourUtc).padStart(2, "0")}:00:00Z`);

describe("cold weather under the current ACI 306R definition (issue item 2)", () => {
  it("air at or below 40 °F on an inch-pound project is cold weather; 41 °F is not", () => {
    const cold = coldWeatherFindings(input({ project: ip, weather: [weather({ airTempC: fToC(40), observedAt: at("2026-01-12", 12) })] }));
    expect(cold).toHaveLength(1);
    expect(cold[0]).toMatchObject({ rule: "cold-weather", severity: "caution", subject: { type: "day", id: "2026-01-12" } });
    expect(cold[0].applied).toEqual({ value: 40, limit: 40, unit: "°F" });
    expect(cold[0].message).toContain("40 °F");
    expect(coldWeatherFindings(input({ project: ip, weather: [weather({ airTempC: fToC(41) })] }))).toEqual([]);
  });

  it("4 °C on an SI project is cold weather; 4.5 °C is not", () => {
    expect(coldWeatherFindings(input({ weather: [weather({ airTempC: 4 })] }))).toHaveLength(1);
    expect(coldWeatherFindings(input({ weather: [weather({ airTempC: 4.5 })] }))).toEqual([]);
  });

  it("the finding names its rule, the section minimums of the day's placements and the cautions (carbon monoxide, 3.5 MPa / 500 psi)", () => {
    const p = placement({ plannedStart: at("2026-01-12", 14), leastDimensionMm: 250 });
    const [si] = coldWeatherFindings(input({ placements: [p], weather: [weather({ airTempC: 2, observedAt: at("2026-01-12", 12) })] }));
    expect(si.source).toEqual({ document: "ACI 306R", basis: "published" });
    expect(si.message).toContain("Level 2 deck at or above 13 °C");
    expect(si.message).toContain("carbon monoxide");
    expect(si.message).toContain("about 3.5 MPa");
    const [us] = coldWeatherFindings(input({ project: ip, placements: [p], weather: [weather({ airTempC: 2, observedAt: at("2026-01-12", 12) })] }));
    expect(us.message).toContain("Level 2 deck at or above 55 °F");
    expect(us.message).toContain("about 500 psi");
  });
});

describe("cold weather under ACI 306.1-90 (issue item 8)", () => {
  const p1990 = (units: "SI" | "IP") => project({ coldWeatherDefinition: "aci306-1990", unitSystem: units });
  // One reading at 06:00 and one at 15:00 local each day: the mean of high and low.
  const days = (dates: string[], lowC: number, highC: number) =>
    dates.flatMap((d, i) => [
      weather({ id: `${d}-lo`, observedAt: at(d, 12), airTempC: lowC, placementId: null }),
      weather({ id: `${d}-hi`, observedAt: at(d, 21), airTempC: highC, placementId: null, concreteTempC: null }),
    ].map((w) => ({ ...w, id: `${w.id}-${i}` })));
  const four = ["2026-01-10", "2026-01-11", "2026-01-12", "2026-01-13"];

  it("an average below 5 °C (SI edition [memory]) for more than 3 successive days is cold weather on the fourth", () => {
    const findings = coldWeatherFindings(input({ project: p1990("SI"), weather: days(four, 0, 9) }));
    // Means of 4.5 °C: days 1–3 are not yet cold weather, day 4 is.
    expect(findings.map((f) => f.subject.id)).toEqual(["2026-01-13"]);
    expect(findings[0].source).toEqual({ document: "ACI 306.1", edition: "90", basis: "memory" });
    expect(findings[0].applied.limit).toBe(5);
  });

  it("inch-pound: below 40 °F [src: ACI 306.1-90]; a mean of exactly 40 °F does not count", () => {
    expect(coldWeatherFindings(input({ project: p1990("IP"), weather: days(four, fToC(30), fToC(49)) }))).toHaveLength(1);
    expect(coldWeatherFindings(input({ project: p1990("IP"), weather: days(four, fToC(30), fToC(50)) }))).toEqual([]);
  });

  it("not cold weather when the air is above 10 °C for more than half of a day [src: ACI 306R-88 as quoted in the AASHTO glossary]", () => {
    // Day 4 is warm from 08:00 to 21:00 local (13 h above 10 °C) though its mean stays below 5 °C.
    const warm = [
      ...days(four.slice(0, 3), 0, 9),
      ...[-2, 11, 11, 11, 11, 11, 11, 11, 11, 11, 11, 11, 11, 11, -2].map((t, h) =>
        weather({ id: `warm-${h}`, placementId: null, observedAt: new Date(Date.UTC(2026, 0, 13, 13 + h)), airTempC: t === 11 ? 11 : -8 }),
      ),
    ];
    expect(coldWeatherFindings(input({ project: p1990("SI"), weather: warm }))).toEqual([]);
  });
});

describe("protection and curing readings (issue item 3)", () => {
  const reading = (tempC: number) => ({ id: "c1", placementId: "p1", readAt: new Date("2026-01-12T12:00:00Z"), tempC });

  it("inch-pound: a 55 °F reading on a section under 12 in meets the published 55 °F minimum; 54 °F does not", () => {
    expect(curingFinding(reading(fToC(55)), placement(), ip)).toBeNull();
    const low = curingFinding(reading(fToC(54)), placement(), ip);
    expect(low?.severity).toBe("warning");
    expect(low?.applied).toEqual({ value: 54, limit: 55, unit: "°F" });
    expect(low?.title).toBe("Below the minimum for this section: 54 °F (minimum 55 °F)");
  });

  it("SI: 13 °C under 300 mm; 10 °C from 300 to 900 mm (exactly 300 mm is the second column)", () => {
    expect(curingFinding(reading(13), placement(), project())).toBeNull();
    expect(curingFinding(reading(12.9), placement(), project())?.applied.limit).toBe(13);
    expect(curingFinding(reading(10), placement({ leastDimensionMm: 300 }), project())).toBeNull();
    expect(curingFinding(reading(9.9), placement({ leastDimensionMm: 300 }), project())?.applied.limit).toBe(10);
  });

  it("cites ACI 306R and carries the heater and freezing cautions; no section size, no verdict", () => {
    const low = curingFinding(reading(5), placement(), project())!;
    expect(low.source.document).toBe("ACI 306R");
    expect(low.message).toContain("carbon monoxide");
    expect(low.message).toContain("3.5 MPa");
    expect(curingFinding(reading(5), placement({ leastDimensionMm: null }), project())).toBeNull();
    expect(evaluate(input({ curing: [reading(5)] })).map((f) => f.rule)).toContain("curing-temperature");
  });
});
