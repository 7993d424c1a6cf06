// The digest builder on the demo scenario's days (scripts/seed/records-data.ts): exactly the day's
// placements and warnings, in the project's units and time zone, each warning naming its rule.
import { describe, expect, it } from "vitest";
import { DEMO_IDS } from "@/scripts/seed/ids";
import { buildDigest, digestLinks } from "@/lib/digest/content";
import { demoDay } from "./digest-demo-day";

const L = DEMO_IDS.projects.larkspur;
const M = DEMO_IDS.projects.millrace;
const ORIGIN = "https://placewright.example.test";
const build = (day: ReturnType<typeof demoDay>) =>
  buildDigest(day, digestLinks(ORIGIN, day.project.id, day.date, `${ORIGIN}/digest/unsubscribe?token=t`));
const warningsOf = (m: ReturnType<typeof build>) => m.summary.warnings.map((w) => `${w.severity} ${w.rule}: ${w.title}`);

/** The lines of one section of the text part, up to the next heading. */
function section(text: string, heading: string): string[] {
  const lines = text.split("\n");
  const start = lines.indexOf(heading.toUpperCase());
  const end = lines.findIndex((l, i) => i > start && (l === "" || /^[A-Z ()]+$/.test(l)));
  return lines.slice(start + 1, end === -1 ? undefined : end);
}

describe("Larkspur Commons, 2026-11-17: the hot, windy deck placement", () => {
  const message = build(demoDay(L, "2026-11-17"));

  it("lists exactly that day's placement, with volume in yd³, state and signature", () => {
    expect(message.summary.placements.map((p) => p.element)).toEqual(["Level 2 deck"]);
    expect(section(message.text, "Placements")).toEqual([
      "- Level 2 deck [Placed]",
      "  L2 · A–L / 1–5 · LC-5000-D · start 9:30 AM",
      "  118.0 yd³ planned · 30.0 yd³ delivered in 3 trucks",
      "  Not signed yet",
    ]);
  });

  it("raises exactly the rulebook's findings for the day, each with its rule and who governs", () => {
    expect(warningsOf(message)).toEqual([
      "warning evaporation: High evaporation: 0.218 lb/ft²/h",
      "warning evaporation: High evaporation: 0.449 lb/ft²/h",
      "warning evaporation: High evaporation: 0.335 lb/ft²/h",
      "caution slump: Slump out of tolerance: 6.5 in (range 3.0–5.0 in)",
      "caution hot-weather: Hot weather: up to 95 °F with high evaporation",
    ]);
    const peak = message.summary.warnings[1];
    // Uno's IP form of the ACI 305R nomograph at 95 °F air, 30 % RH, 18 mph, 92 °F concrete ≈ 0.45 lb/ft²/h.
    expect(peak.context).toBe("2:00 PM · Level 2 deck");
    // LC-5000-D has silica fume: half the ACI 305R level (Silica Fume Association guidance), quoted as applied.
    expect(peak.message).toContain("0.1 lb/ft²/h, half the ACI 305R level for a low-bleed mix");
    expect(message.text).toContain("Rule: Silica Fume Association guidance for low-bleed mixes. The project specification, local codes and the engineer of record govern");
    // ASTM C94 slump band for a 4 in target: ±1 in; the check test on the same load passed, so a caution.
    const slump = message.summary.warnings[3];
    expect(slump.message).toContain("A check test on the same load was within range");
    expect(message.text).toContain("Rule: ASTM C94 slump and air content tolerances [from memory, not checked against the text].");
  });

  it("shows the trucks with the rejected load, the cylinders made and the 7-day breaks received", () => {
    expect(message.summary.trucks).toMatchObject({ accepted: 3, rejected: 1, late: 0, waterAdded: null, volume: "30.0 yd³" });
    expect(message.text).toContain("Rejected: Concrete at 97 °F on arrival");
    expect(message.summary.specimens).toEqual([
      "Set LC-D2-A: 5 cylinders 4 × 8 in, cast 2:15 PM (Level 2 deck); tests at 7 and 28 days",
      // The maturity calibration set of the same mix, broken at 1, 2, 3 and 7 days (scripts/seed/maturity-data.ts).
      "Set LC-D2-CAL: 8 cylinders 4 × 8 in, cast 2:20 PM (Level 2 deck); tests at 1, 2, 3 and 7 days",
    ]);
    expect(message.summary.breaks.map((b) => b.low)).toEqual([false]);
    // Two of three 100 mm cylinders: not yet a strength test (ACI 318 counts three of that size).
    expect(message.summary.breaks[0].text).toMatch(/^Set LC-SW1-A \(Shear walls SW-1 to SW-4, level 1 to 2\), 7 days: .*not yet a strength test \(2 of 3 cylinders\)/);
    expect(message.summary.diary).toMatchObject({ crewTotal: 17, delays: ["Rejected load, 20 min: Truck 44 at 97 °F; waited for the next load"] });
  });

  it("has a subject, a link to the day in the app and the unsubscribe link, in both parts", () => {
    expect(message.subject).toBe("Larkspur Commons, Tue, Nov 17: 1 placement, 5 warnings");
    for (const part of [message.html, message.text]) {
      expect(part).toContain(`${ORIGIN}/projects/${L}?date=2026-11-17`);
      expect(part).toContain(`${ORIGIN}/digest/unsubscribe?token=t`);
    }
    expect(message.html.match(/data-rule="/g)).toHaveLength(5);
  });
});

describe("other demo days", () => {
  it("2026-11-10: the late truck (project limit from ASTM C94) and the water added at the chute", () => {
    const message = build(demoDay(L, "2026-11-10"));
    expect(message.summary.placements.map((p) => p.element)).toEqual(["Shear walls SW-1 to SW-4, level 1 to 2"]);
    expect(warningsOf(message)).toEqual([
      "warning discharge-time: Late truck: ticket BR-242213 (truck 31), 96 min from batching",
      "caution site-water: Water added at site: ticket BR-242213 (truck 31), 10.0 gal",
    ]);
    expect(message.summary.warnings[0].message).toContain("96 min after batching, over the 90 min (ASTM C94) limit");
    expect(message.text).toContain("Rule: ASTM C94 §10.7.");
    expect(message.summary.trucks).toMatchObject({ late: 1, waterAdded: "10.0 gal" });
  });

  it("applies the project's own discharge limit when its specification shortens it", () => {
    const message = build(demoDay(L, "2026-11-17", { dischargeLimitMinutes: 60 }));
    const late = message.summary.warnings.filter((w) => w.rule === "discharge-time");
    expect(late.map((w) => w.title)).toEqual(["Late truck: ticket BR-243107 (truck 19), 62 min from batching"]);
    expect(late[0].message).toContain("60 min (project specification; ASTM C94 default 90 min)");
    expect(late[0].source).toEqual({ document: "Project specification", basis: "project" });
  });

  it("Millrace Pump House, 2026-11-12: cold weather with the minimum for the wall section, in SI, and the cold curing reading", () => {
    const message = build(demoDay(M, "2026-11-12"));
    expect(message.summary.placements.map((p) => p.volume)).toEqual(["28.0 m³ planned · 14.0 m³ delivered in 2 trucks"]);
    expect(warningsOf(message)).toEqual([
      "warning curing-temperature: Below the minimum for this section: 8 °C (minimum 10 °C)",
      "caution cold-weather: Cold weather: protect the fresh concrete (air down to -6 °C)",
    ]);
    const cold = message.summary.warnings[1];
    // ACI 306R: a 300 mm wall is in the 300–900 mm column, 10 °C minimum.
    expect(cold.message).toContain("Wet well walls, lift 1 at or above 10 °C");
    expect(cold.message).toContain("ACI 306R: cold weather when the air has fallen to, or is expected to fall below, 4 °C");
    expect(cold.message).toContain("carbon monoxide");
  });

  it("uses the ACI 306.1-90 definition when the project's specification cites it: one cold night is not cold weather", () => {
    const day = demoDay(M, "2026-11-12", { coldWeatherDefinition: "aci306-1990" });
    expect(build(day).summary.warnings.map((w) => w.rule)).toEqual(["curing-temperature"]);
    // Four days of readings averaging below 5 °C (the SI edition's value, from memory) make it cold weather.
    const night = (daysBefore: number, hour: number, airTempC: number) => ({
      ...day.checks.weather[0],
      id: `w-${daysBefore}-${hour}`,
      observedAt: new Date(Date.parse("2026-11-12T12:00:00Z") - daysBefore * 86_400_000 + hour * 3_600_000),
      airTempC,
    });
    const cold = { ...day, checks: { ...day.checks, weather: [0, 1, 2, 3].flatMap((d) => [night(d, 0, -2), night(d, 8, 9)]) } };
    const [finding] = build(cold).summary.warnings.filter((w) => w.rule === "cold-weather");
    expect(finding.message).toContain("below 5 °C for 4 successive days");
    expect(finding.message).toContain("ACI 306.1-90: cold weather when the average daily temperature is below 5 °C for more than 3 successive days");
    expect(finding.source).toEqual({ document: "ACI 306.1", edition: "90", basis: "memory" });
  });

  it("2026-11-25: no placement but the low 28-day strength test (ACI 318-19 §26.12.3.1 b)", () => {
    const message = build(demoDay(L, "2026-11-25"));
    expect(message.isEmpty).toBe(false);
    expect(section(message.text, "Placements")).toEqual(["No placements today."]);
    expect(warningsOf(message)).toEqual(["warning strength-low: Low strength test: set LC-P1-B (Podium slab, east half), 28 days, 3363 psi"]);
    // Average of 3380, 3290, 3420 psi = 3363 psi, below 4000 − 500 psi (ACI 318-19 §26.12.3.1(b)).
    expect(message.summary.warnings[0].message).toMatch(/^The average of 3 cylinders, 336\d psi, is below the 3500 psi limit for f′c 4000 psi/);
    expect(message.summary.warnings[0].message).toContain("engineer of record");
    expect(message.summary.breaks.map((b) => b.low)).toEqual([false, true]);
  });

  it("2026-10-28: a signed placement says who signed and when", () => {
    const message = build(demoDay(L, "2026-10-28"));
    expect(message.summary.placements.map((p) => `${p.stateLabel}: ${p.signed}`)).toEqual(["Signed: Signed by Ines Marchetti at 3:10 PM"]);
    expect(message.summary.warnings).toEqual([]);
  });

  it("2026-11-22, nothing recorded: one line, no placements", () => {
    const message = build(demoDay(L, "2026-11-22"));
    expect(message.isEmpty).toBe(true);
    expect(message.subject).toBe("Larkspur Commons, Sun, Nov 22: No placements today");
    expect(message.text.split("\n")[0]).toBe(`Larkspur Commons, Sunday, November 22, 2026: No placements today. ${ORIGIN}/projects/${L}?date=2026-11-22`);
    expect(message.html).toContain("No placements today.");
  });

  it("escapes what the field typed", () => {
    const day = demoDay(L, "2026-11-17");
    day.placements[0].element = `Deck <img src=x onerror="alert(1)">`;
    const message = build(day);
    expect(message.html).not.toContain("<img src=x");
    expect(message.html).toContain("Deck &lt;img src=x onerror=&quot;alert(1)&quot;&gt;");
  });
});
