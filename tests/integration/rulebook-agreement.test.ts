// One verdict everywhere: for random projects (SI and inch-pound, each cold-weather definition, with
// and without the project's own limits), mixes and a day of random records written through the real
// write path, the findings on the field device's model, the server's stored findings, the digest
// e-mail, the review table's "has warnings" and the PDF daily report are the same set (fast-check).
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import fc from "fast-check";
import { extractText, getDocumentProxy } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { breaks, checkFindings, curingReadings, deliveries, fieldTests, mixDesigns, placements, projects, specimenSets, weatherObservations } from "@/db/schema";
import * as placementsRoute from "@/app/api/review/placements/route";
import { attention, evaluate, findingKey, onDate, toCheckInput, type Finding } from "@/lib/checks";
import { buildDigest, digestLinks } from "@/lib/digest/content";
import { loadDigestDay } from "@/lib/digest/load";
import { createRecord } from "@/lib/records/write";
import { accessTo } from "@/lib/auth/access";
import { buildDailyReport } from "@/lib/reports/daily";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { addMembership, callRoute, createProject, createUser, type TestUser } from "./helpers";

// A past day: readings and truck times in the future are refused by the record schemas.
const DATE = "2026-01-15";
// 10:00 in Chicago on DATE (CST, UTC−6).
const T = (minutes: number) => new Date(Date.parse(`${DATE}T10:00:00-06:00`) + minutes * 60_000).toISOString();

type Team = Record<"superintendent" | "inspector" | "office", TestUser>;
let team: Team;

beforeAll(async () => {
  team = {
    superintendent: await createUser({ name: "Agreement super" }),
    inspector: await createUser({ name: "Agreement inspector" }),
    office: await createUser({ name: "Agreement office" }),
  };
});

const projectArb = fc.record({
  unitSystem: fc.constantFrom("SI" as const, "IP" as const),
  coldWeatherDefinition: fc.constantFrom("aci306r-current" as const, "aci306-1990" as const),
  evaporationHighKgM2H: fc.constantFrom(null, 0.8),
  dischargeLimitMinutes: fc.constantFrom(90, 60),
  revolutionLimit: fc.constantFrom(null, 300),
});
const mixArb = fc.record({
  slumpToleranceMm: fc.constantFrom(null, 20),
  airTolerancePct: fc.constantFrom(null, 1),
  lowBleed: fc.boolean(),
  maxConcreteTempC: fc.constantFrom(null, 32),
  siteWaterAllowedLPerM3: fc.constantFrom(0, 10),
});
const deliveryArb = fc.record({
  finish: fc.constantFrom(null, 60, 89, 95, 120),
  revolutions: fc.constantFrom(null, 250, 310),
  water: fc.constantFrom(null, 30, 100),
  waterSpan: fc.constantFrom(5, 20),
  rejected: fc.boolean(),
  // The mix code on the ticket: none, the placement's mix (written another way), another mix.
  mixCode: fc.constantFrom(null, "same", "other"),
});
const testArb = fc.record({
  slumpMm: fc.constantFrom(100, 126, 160),
  airPct: fc.constantFrom(null, 6, 7.2, 8),
  concreteTempC: fc.constantFrom(null, 24, 33, 36),
  delivery: fc.nat(3),
});
const weatherArb = fc.record({
  airTempC: fc.constantFrom<number>(-5, 3, 10, 25, 32),
  relativeHumidityPct: fc.constantFrom<number>(20, 50, 90),
  windKmh: fc.constantFrom<number>(5, 20, 40),
  concreteTempC: fc.constantFrom<number | null>(null, 15, 28, 35),
  onPlacement: fc.boolean(),
});
const dayArb = fc.record({
  project: projectArb,
  mix: mixArb,
  leastDimensionMm: fc.constantFrom(250, 600),
  // Quiet days too: a day with only weather tells day-level findings from the placement's own.
  deliveries: fc.oneof(fc.constant([]), fc.array(deliveryArb, { minLength: 1, maxLength: 3 })),
  tests: fc.oneof(fc.constant([]), fc.array(testArb, { minLength: 1, maxLength: 3 })),
  weather: fc.array(weatherArb, { minLength: 1, maxLength: 3 }),
  curing: fc.oneof(fc.constant([]), fc.array(fc.constantFrom(5, 12, 14, 20), { minLength: 1, maxLength: 2 })),
  cylinderDiameterMm: fc.constantFrom(100, 150),
  breakLoadsKN: fc.oneof(fc.constant([]), fc.array(fc.constantFrom(150, 250, 400, 530), { minLength: 1, maxLength: 3 })),
});
type Day = typeof dayArb extends fc.Arbitrary<infer T> ? T : never;
const QUIET: Day = {
  project: { unitSystem: "SI", coldWeatherDefinition: "aci306r-current", evaporationHighKgM2H: null, dischargeLimitMinutes: 90, revolutionLimit: null },
  mix: { slumpToleranceMm: null, airTolerancePct: null, lowBleed: false, maxConcreteTempC: null, siteWaterAllowedLPerM3: 0 },
  leastDimensionMm: 600,
  deliveries: [],
  tests: [],
  weather: [],
  curing: [],
  cylinderDiameterMm: 150,
  breakLoadsKN: [],
};

async function writeDay(day: Day) {
  const project = await createProject({ unitSystem: day.project.unitSystem });
  await db.update(projects).set(day.project).where(eq(projects.id, project.id));
  for (const [role, user] of Object.entries(team)) await addMembership(user.id, project.id, role as keyof Team);
  const write = (role: keyof Team, type: string, body: Record<string, unknown>) => createRecord({ user: team[role] }, type, project.id, { id: randomUUID(), ...body });
  const mix = await write("office", "mix-designs", {
    code: `AG-${project.code}`, fcMPa: 27.6, fcAgeDays: 28, slumpTargetMm: 100, slumpType: "target", airTargetPct: 6, ...day.mix,
  });
  const placement = await write("superintendent", "placements", {
    element: "Agreement deck", elementType: "elevated-slab", leastDimensionMm: day.leastDimensionMm, plannedVolumeM3: 40, plannedStart: T(0), mixId: mix.record.id,
  });
  const placementId = placement.record.id as string;
  const deliveryIds: string[] = [];
  for (const [k, d] of day.deliveries.entries()) {
    const b = k * 20;
    const r = await write("superintendent", "deliveries", {
      placementId, ticketNumber: `AG-${k}`, truck: String(30 + k), volumeM3: 8,
      mixCode: d.mixCode === null ? null : d.mixCode === "same" ? `ag ${project.code}` : "LC-5000-B",
      batchedAt: T(b), arrivedAt: T(b + 25), dischargeStartedAt: T(b + 30),
      dischargeFinishedAt: d.finish === null ? null : T(b + d.finish), revolutions: d.revolutions,
      ...(d.water === null ? {} : { waterAddedL: d.water, waterFirstAt: T(b + 26), waterLastAt: T(b + 26 + d.waterSpan), waterAddedBy: "Driver", waterAuthorisedBy: "Sam" }),
      ...(d.rejected ? { status: "rejected", rejectReason: "Too hot" } : {}),
    });
    deliveryIds.push(r.record.id as string);
  }
  for (const [k, t] of day.tests.entries()) {
    await write("inspector", "field-tests", {
      placementId, deliveryId: deliveryIds.length ? deliveryIds[t.delivery % deliveryIds.length] : null, sampledAt: T(40 + k * 7),
      slumpMm: t.slumpMm, airPct: t.airPct, concreteTempC: t.concreteTempC,
    });
  }
  for (const [k, w] of day.weather.entries()) {
    await write("superintendent", "weather-observations", {
      placementId: w.onPlacement ? placementId : null, observedAt: T(k * 90), airTempC: w.airTempC, relativeHumidityPct: w.relativeHumidityPct, windKmh: w.windKmh, concreteTempC: w.concreteTempC,
    });
  }
  for (const [k, tempC] of day.curing.entries()) {
    await write("superintendent", "curing-readings", { placementId, method: "Blankets", readAt: T(300 + k * 60), tempC, location: "Edge" });
  }
  if (day.breakLoadsKN.length) {
    // Cast 28 days before DATE, so the breaks on DATE are at the mix's design age.
    const set = await write("inspector", "specimen-sets", {
      placementId, setCode: `AG-${project.code}`, cylinderDiameterMm: day.cylinderDiameterMm, cylinderLengthMm: day.cylinderDiameterMm * 2, count: 4,
      castAt: new Date(Date.parse(T(60)) - 28 * 86_400_000).toISOString(), testAgesDays: [28],
    });
    for (const [k, loadKN] of day.breakLoadsKN.entries()) {
      const kN = day.cylinderDiameterMm === 100 ? loadKN * 0.45 : loadKN;
      await write("office", "breaks", { specimenSetId: set.record.id, testedAt: T(120 + k), ageDays: 28, loadKN: kN, diameterMm: day.cylinderDiameterMm, lengthMm: day.cylinderDiameterMm * 2, fractureType: 2 });
    }
  }
  return { projectId: project.id, placementId };
}

/** The device's view: the rows as a pull delivers them (JSON: dates as ISO strings), judged on the phone. */
async function deviceFindings(projectId: string): Promise<Finding[]> {
  const rowsOf = async <T>(q: Promise<T[]>) => JSON.parse(JSON.stringify(await q)) as Record<string, unknown>[];
  const [project] = await rowsOf(db.select().from(projects).where(eq(projects.id, projectId)));
  const input = toCheckInput({
    project,
    mixes: await rowsOf(db.select().from(mixDesigns).where(eq(mixDesigns.projectId, projectId))),
    placements: await rowsOf(db.select().from(placements).where(eq(placements.projectId, projectId))),
    deliveries: await rowsOf(db.select().from(deliveries).where(eq(deliveries.projectId, projectId))),
    fieldTests: await rowsOf(db.select().from(fieldTests).where(eq(fieldTests.projectId, projectId))),
    weather: await rowsOf(db.select().from(weatherObservations).where(eq(weatherObservations.projectId, projectId))),
    curing: await rowsOf(db.select().from(curingReadings).where(eq(curingReadings.projectId, projectId))),
    specimenSets: await rowsOf(db.select().from(specimenSets).where(eq(specimenSets.projectId, projectId))),
    breaks: await rowsOf(db.select().from(breaks).where(eq(breaks.projectId, projectId))),
  });
  return attention(onDate(evaluate(input), DATE, input.project.timeZone));
}

const sorted = (keys: Iterable<string>) => [...keys].sort();
const normalise = (text: string) => text.replace(/\s+/g, " ");

describe("one verdict on every surface", () => {
  it("the device, the stored findings, the digest, the review table and the PDF show the same findings", async () => {
    let warnedDays = 0;
    let wrongMixes = 0;
    await fc.assert(
      fc.asyncProperty(dayArb, async (day) => {
        const { projectId, placementId } = await writeDay(day);

        const device = await deviceFindings(projectId);
        const expected = sorted(device.map(findingKey));
        if (expected.length) warnedDays++;
        wrongMixes += device.filter((f) => f.rule === "mix-code").length;

        const stored = await db.select().from(checkFindings).where(eq(checkFindings.projectId, projectId));
        expect(sorted(stored.map((f) => findingKey({ rule: f.rule as Finding["rule"], severity: f.severity as Finding["severity"], subject: { type: f.subjectType, id: f.subjectId } as Finding["subject"] }))), "stored").toEqual(expected);

        const digestDay = await loadDigestDay(projectId, DATE);
        const digest = buildDigest(digestDay, digestLinks("https://placewright.example.test", projectId, DATE, null));
        const inMail = [...digest.html.matchAll(/data-rule="([^"]+)" data-severity="([^"]+)" data-subject="([^:"]+):([^"]+)"/g)].map(
          ([, rule, severity, type, id]) => findingKey({ rule: rule as Finding["rule"], severity: severity as Finding["severity"], subject: { type, id } as Finding["subject"] }),
        );
        expect(sorted(inMail), "digest").toEqual(expected);

        const res = await callRoute(placementsRoute.GET, { user: team.office, url: `/api/review/placements?projects=${projectId}&pageSize=10` });
        const row = (res.json.rows as PlacementReviewRow[]).find((r) => r.id === placementId)!;
        const forPlacement = device.filter((f) => f.placementId === placementId || f.subject.type === "day");
        expect(row.hasWarnings, "review has warnings").toBe(forPlacement.length > 0);
        expect(row.lateTrucks, "review late trucks").toBe(forPlacement.filter((f) => f.rule === "discharge-time").length);
        expect(row.testsOut, "review tests out").toBe(new Set(forPlacement.filter((f) => f.subject.type === "field-test").map((f) => f.subject.id)).size);

        const { pdf } = await buildDailyReport(await accessTo(team.office, projectId), DATE);
        const text = normalise((await extractText(await getDocumentProxy(pdf), { mergePages: true })).text);
        expect(text, "PDF count").toContain(`Warnings (${device.length})`);
        for (const f of device) expect(text, "PDF finding").toContain(normalise(`${f.severity === "warning" ? "Warning" : "Caution"}: ${f.title}`));
      }),
      {
        numRuns: 20,
        seed: 20261203,
        // Kept as examples: a quiet cold night where only the day is flagged (the review table once
        // left day-level cold weather out of "has warnings"), and an inch-pound afternoon at 80/80 °F,
        // 50 %, 15 mph where the phone once used the SI form.
        examples: [
          // A ticket naming another mix than the placement's: a warning on every surface.
          [{ ...QUIET, deliveries: [{ finish: 60, revolutions: null, water: null, waterSpan: 5, rejected: false, mixCode: "other" as const }], weather: [{ airTempC: 10, relativeHumidityPct: 90, windKmh: 5, concreteTempC: null, onPlacement: false }] }],
          [{ ...QUIET, weather: [{ airTempC: -5, relativeHumidityPct: 90, windKmh: 5, concreteTempC: null, onPlacement: false }] }],
          [{ ...QUIET, project: { ...QUIET.project, unitSystem: "IP" as const }, weather: [{ airTempC: 26.667, relativeHumidityPct: 50, windKmh: 24.14, concreteTempC: 26.667, onPlacement: true }] }],
        ],
      },
    );
    // The random days cover days with and without findings.
    expect(warnedDays).toBeGreaterThan(0);
    expect(wrongMixes, "a wrong mix on a ticket was generated and found").toBeGreaterThan(0);
  }, 300_000);
});
