// Builds the digest input for one demo day straight from the demo scenario's records (the seed's
// source), with the same day rules as lib/digest/load.ts, so the builder is tested without a database.
import { DEMO_PROJECTS, DEMO_USERS } from "@/scripts/seed/ids";
import type { DemoRecord } from "@/scripts/seed/ids";
import { demoRecords } from "@/scripts/seed/records-data";
import { toCheckInput } from "@/lib/checks";
import { addDays, localDayRange } from "@/lib/time/zone";
import type { DigestDay, DigestMix, DigestPlacement } from "@/lib/digest/types";
import { computeBreak, computeWeather } from "@/lib/records/compute";
import type { RecordType } from "@/lib/records/registry";

type Values = Record<string, unknown>;
const v = (r: DemoRecord) => r.values as Values & { id: string };

export function demoDay(projectId: string, date: string, overrides: Partial<DigestDay["project"]> = {}): DigestDay {
  const base = DEMO_PROJECTS.find((p) => p.id === projectId)!;
  const project: DigestDay["project"] = {
    id: base.id,
    name: base.name,
    code: base.code,
    timeZone: base.timeZone,
    unitSystem: base.unitSystem,
    specEditions: base.specEditions,
    dischargeLimitMinutes: 90,
    revolutionLimit: null,
    evaporationHighKgM2H: null,
    maxConcreteTempC: 35,
    coldWeatherDefinition: "aci306r-current",
    ...overrides,
  };
  // A type may come more than once (the maturity records add specimen sets and breaks of their own).
  const all = new Map<RecordType, DemoRecord[]>();
  for (const [type, rows] of demoRecords()) all.set(type, [...(all.get(type) ?? []), ...rows]);
  const mine = (type: Parameters<typeof all.get>[0]) => (all.get(type) ?? []).filter((r) => r.projectId === projectId);
  const { start, end } = localDayRange(date, project.timeZone);
  const inDay = (value: unknown) => value instanceof Date && value >= start && value < end;

  const mixes = new Map(
    mine("mix-designs").map((r): [string, DigestMix] => {
      const m = v(r);
      return [m.id, {
        code: m.code as string, fcMPa: m.fcMPa as number, fcAgeDays: (m.fcAgeDays as number) ?? 28,
        slumpTargetMm: (m.slumpTargetMm as number) ?? null, slumpType: (m.slumpType as "target" | "maximum") ?? "target",
        slumpToleranceMm: (m.slumpToleranceMm as number) ?? null, airTargetPct: (m.airTargetPct as number) ?? null,
        airTolerancePct: (m.airTolerancePct as number) ?? null, maxConcreteTempC: (m.maxConcreteTempC as number) ?? null,
        siteWaterAllowedLPerM3: (m.siteWaterAllowedLPerM3 as number) ?? 0, lowBleed: (m.lowBleed as boolean) ?? false,
      }];
    }),
  );
  const placements = mine("placements").map((r): DigestPlacement => {
    const p = v(r);
    return {
      id: p.id, element: p.element as string, level: (p.level as string) ?? "", grid: (p.grid as string) ?? "",
      leastDimensionMm: (p.leastDimensionMm as number) ?? null, plannedVolumeM3: (p.plannedVolumeM3 as number) ?? null,
      plannedStart: p.plannedStart as Date, state: r.signedAt ? "signed" : (r.extra!.state as DigestPlacement["state"]),
      holdReason: (r.extra?.holdReason as string) ?? null, signedAt: r.signedAt ?? null,
      signedByName: r.signedBy ? DEMO_USERS.find((u) => u.id === r.signedBy)!.name : null,
      mix: mixes.get(p.mixId as string) ?? null,
    };
  });

  const rows = (type: Parameters<typeof all.get>[0], dateField: string) => mine(type).map(v).filter((x) => inDay(x[dateField]));
  const nul = <T,>(x: unknown) => (x ?? null) as T | null;
  const deliveries = rows("deliveries", "arrivedAt").map((d) => ({
    id: d.id, placementId: d.placementId as string, ticketNumber: d.ticketNumber as string, truck: (d.truck as string) ?? "",
    volumeM3: d.volumeM3 as number, mixCode: (d.mixCode as string | null) ?? null, batchedAt: d.batchedAt as Date, arrivedAt: d.arrivedAt as Date,
    dischargeFinishedAt: nul<Date>(d.dischargeFinishedAt), revolutions: nul<number>(d.revolutions), waterAddedL: nul<number>(d.waterAddedL),
    waterFirstAt: nul<Date>(d.waterFirstAt), waterLastAt: nul<Date>(d.waterLastAt), waterAddedBy: nul<string>(d.waterAddedBy),
    waterAuthorisedBy: nul<string>(d.waterAuthorisedBy), status: ((d.status as string) ?? "accepted") as "accepted" | "rejected",
    rejectReason: nul<string>(d.rejectReason),
  }));
  const fieldTests = rows("field-tests", "sampledAt").map((t) => ({
    id: t.id, placementId: t.placementId as string, deliveryId: nul<string>(t.deliveryId), sampledAt: t.sampledAt as Date,
    slumpMm: nul<number>(t.slumpMm), airPct: nul<number>(t.airPct), concreteTempC: nul<number>(t.concreteTempC),
  }));
  const weather = rows("weather-observations", "observedAt").map((w) => ({
    placementId: nul<string>(w.placementId), observedAt: w.observedAt as Date, airTempC: w.airTempC as number,
    relativeHumidityPct: w.relativeHumidityPct as number, windKmh: w.windKmh as number, concreteTempC: nul<number>(w.concreteTempC),
    evaporationKgM2H: computeWeather(w, { unitSystem: project.unitSystem }).evaporationKgM2H,
  }));
  const allSets = mine("specimen-sets").map(v);
  const specimenSets = allSets.filter((s) => inDay(s.castAt)).map((s) => ({
    id: s.id, placementId: s.placementId as string, setCode: s.setCode as string, castAt: s.castAt as Date, count: s.count as number,
    cylinderDiameterMm: s.cylinderDiameterMm as number, cylinderLengthMm: s.cylinderLengthMm as number, testAgesDays: s.testAgesDays as number[],
  }));
  const breaks = rows("breaks", "testedAt").map((b) => {
    const set = allSets.find((s) => s.id === b.specimenSetId)!;
    return {
      specimenSetId: set.id, setCode: set.setCode as string, placementId: set.placementId as string,
      cylinderDiameterMm: set.cylinderDiameterMm as number, testedAt: b.testedAt as Date, ageDays: b.ageDays as number,
      strengthMPa: computeBreak(b).strengthMPa,
    };
  });
  const entry = mine("diary-entries").map((r) => ({ r, d: v(r) })).find(({ d }) => d.date === date);
  const children = (type: Parameters<typeof all.get>[0]) => mine(type).map(v).filter((c) => entry && c.diaryEntryId === entry.d.id);
  const diary = entry
    ? {
        submitted: Boolean(entry.r.extra?.submittedAt), weatherSummary: entry.d.weatherSummary as string, workDone: entry.d.workDone as string,
        crew: children("diary-crew").map((c) => ({ trade: c.trade as string, count: c.count as number })),
        delays: children("diary-delays").map((c) => ({ cause: c.cause as string, minutes: c.minutes as number, description: (c.description as string) ?? "" })),
      }
    : null;

  const today = placements.filter((p) => inDay(p.plannedStart));
  const referenced = new Set([...deliveries, ...fieldTests, ...specimenSets, ...breaks].map((x) => x.placementId));
  weather.forEach((w) => w.placementId && referenced.add(w.placementId));
  return {
    project, date, placements: today,
    otherPlacements: placements.filter((p) => referenced.has(p.id) && !today.includes(p)),
    deliveries, fieldTests, weather, checks: checkDay(), specimenSets, breaks, diary, photos: [],
  };

  // What lib/findings/load.ts reads for the rulebook: the day's records, three days of weather before
  // it under ACI 306.1-90, every break of a set broken that day, and the trucks and sets of a placement planned that day.
  function checkDay() {
    const from = project.coldWeatherDefinition === "aci306-1990" ? localDayRange(addDays(date, -3), project.timeZone).start : start;
    const within = (type: Parameters<typeof all.get>[0], field: string, since = start) =>
      mine(type).map(v).filter((x) => x[field] instanceof Date && (x[field] as Date) >= since && (x[field] as Date) < end);
    const brokenSets = new Set(breaks.map((b) => b.specimenSetId));
    // A placement planned that day is judged whole for whether cylinders were made.
    const planned = new Set(today.map((p) => p.id));
    const ofPlanned = (type: Parameters<typeof all.get>[0]) => mine(type).map(v).filter((x) => planned.has(x.placementId as string));
    const dayDeliveries = within("deliveries", "arrivedAt");
    return toCheckInput({
      project: project as unknown as Values,
      mixes: mine("mix-designs").map(v),
      placements: mine("placements").map(v),
      deliveries: [...dayDeliveries, ...ofPlanned("deliveries").filter((d) => !dayDeliveries.includes(d))],
      fieldTests: within("field-tests", "sampledAt"),
      weather: within("weather-observations", "observedAt", from),
      curing: within("curing-readings", "readAt"),
      specimenSets: allSets.filter((s) => brokenSets.has(s.id) || planned.has(s.placementId as string)),
      breaks: mine("breaks").map(v).filter((b) => brokenSets.has(b.specimenSetId as string)).map((b) => ({ ...b, strengthMPa: computeBreak(b).strengthMPa })),
    });
  }
}
