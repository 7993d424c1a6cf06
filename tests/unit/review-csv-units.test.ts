// The review CSV in the project's units (issue 17 item 8): an inch-pound project exported 34.40496861
// (m³) for 45 yd³. Now the screen's figures and units, parsed back with papaparse. Conversion values:
// 1 yd³ = 0.764554857984 m³ and 1 US gal = 3.785411784 L exactly [NIST SP 811, Appendix B].
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { formatVolume, formatWaterVolume } from "@/lib/concrete";
import { PLACEMENT_MEASURES } from "@/lib/review/columns";
import { placementsCsv } from "@/lib/review/csv";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";

const YD3_M3 = 0.764554857984;
const GAL_L = 3.785411784;

function row(unitSystem: "SI" | "IP", orderedM3: number, placedM3: number, waterAddedL: number): PlacementReviewRow {
  return {
    date: "2026-11-17", projectName: unitSystem === "IP" ? "Larkspur Commons" : "Millrace Pump House", element: "Level 2 deck", level: "L2", grid: "A–L / 1–5",
    mixCode: "LC-5000-D", orderedM3, placedM3, trucks: 5, lateTrucks: 1, waterAddedL, waterLoads: waterAddedL ? 1 : 0, testsOut: 0,
    evaporationRisk: null, state: "placed", signedBy: null, unitSystem,
  } as unknown as PlacementReviewRow;
}

const parse = (csv: string) => Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });

/** What the screen shows in a cell: the number and the unit of lib/concrete's formatter, split. */
const screen = (text: string) => {
  const [value, unit] = text.split(" ");
  return { value: Number(value), unit };
};

describe("review CSV units", () => {
  it("inch-pound: 45 yd³ ordered, 30 yd³ placed, 10 gal of water read back as the screen shows them, the unit in each header", () => {
    const r = row("IP", 45 * YD3_M3, 30 * YD3_M3, 10 * GAL_L);
    const { data, meta } = parse(placementsCsv([r]));
    expect(meta.fields).toEqual(expect.arrayContaining(["Ordered (yd³)", "Placed (yd³)", "Water added (gal)"]));
    const ordered = screen(formatVolume(r.orderedM3!, "IP", PLACEMENT_MEASURES.orderedM3.digits));
    const placed = screen(formatVolume(r.placedM3, "IP", PLACEMENT_MEASURES.placedM3.digits));
    const water = screen(formatWaterVolume(r.waterAddedL, "IP"));
    expect([ordered.unit, placed.unit, water.unit]).toEqual(["yd³", "yd³", "gal"]);
    expect(Number(data[0]["Ordered (yd³)"])).toBe(ordered.value);
    expect(Number(data[0]["Ordered (yd³)"])).toBe(45);
    expect(Number(data[0]["Placed (yd³)"])).toBe(placed.value);
    expect(Number(data[0]["Water added (gal)"])).toBe(10);
    expect(data[0]["Water added (gal)"]).not.toContain("37.8");
  });

  it("units=si gives the stored SI values unrounded, with SI units in the headers", () => {
    const { data } = parse(placementsCsv([row("IP", 45 * YD3_M3, 30 * YD3_M3, 10 * GAL_L)], undefined, "si"));
    expect(Number(data[0]["Ordered (m³)"])).toBeCloseTo(34.40496861, 8);
    expect(Number(data[0]["Water added (L)"])).toBeCloseTo(37.85411784, 8);
  });

  it("projects of both unit systems in one export share SI headers, rounded as the SI screen", () => {
    const { data, meta } = parse(placementsCsv([row("IP", 45 * YD3_M3, 0, 0), row("SI", 28, 27.94, 0)]));
    expect(meta.fields).toEqual(expect.arrayContaining(["Ordered (m³)", "Placed (m³)"]));
    expect(data.map((d) => Number(d["Ordered (m³)"]))).toEqual([34.4, 28]);
    expect(Number(data[1]["Placed (m³)"])).toBe(27.9);
  });
});
