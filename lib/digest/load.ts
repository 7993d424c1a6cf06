// Reads what one project recorded on one project-local date, for the digest builder. Every query is
// scoped to the project; tombstoned rows are left out.
import { loadSiteStatus } from "./site-status";
import { and, asc, eq, gte, inArray, isNotNull, isNull, lt, type SQL } from "drizzle-orm";
import type { PgColumn } from "drizzle-orm/pg-core";
import { db, type Executor } from "@/db";
import {
  breaks,
  deliveries,
  diaryCrew,
  diaryDelays,
  diaryEntries,
  fieldTests,
  mixDesigns,
  photos,
  placements,
  projects,
  specimenSets,
  users,
  weatherObservations,
} from "@/db/schema";
import { notFound } from "@/lib/errors";
import { loadCheckDay } from "@/lib/findings/load";
import { localDayRange } from "@/lib/time/zone";
import type { DigestDay, DigestPlacement } from "./types";

const placementColumns = {
  id: placements.id,
  element: placements.element,
  level: placements.level,
  grid: placements.grid,
  leastDimensionMm: placements.leastDimensionMm,
  plannedVolumeM3: placements.plannedVolumeM3,
  plannedStart: placements.plannedStart,
  state: placements.state,
  holdReason: placements.holdReason,
  signedAt: placements.signedAt,
  signedByName: users.name,
  mixCode: mixDesigns.code,
  fcMPa: mixDesigns.fcMPa,
  fcAgeDays: mixDesigns.fcAgeDays,
  slumpTargetMm: mixDesigns.slumpTargetMm,
  slumpType: mixDesigns.slumpType,
  slumpToleranceMm: mixDesigns.slumpToleranceMm,
  airTargetPct: mixDesigns.airTargetPct,
  airTolerancePct: mixDesigns.airTolerancePct,
  maxConcreteTempC: mixDesigns.maxConcreteTempC,
  siteWaterAllowedLPerM3: mixDesigns.siteWaterAllowedLPerM3,
  lowBleed: mixDesigns.lowBleed,
};

async function loadPlacements(tx: Executor, projectId: string, where: SQL): Promise<DigestPlacement[]> {
  const rows = await tx
    .select(placementColumns)
    .from(placements)
    .leftJoin(mixDesigns, and(eq(mixDesigns.id, placements.mixId), eq(mixDesigns.projectId, projectId)))
    .leftJoin(users, eq(users.id, placements.signedBy))
    .where(and(eq(placements.projectId, projectId), isNull(placements.deletedAt), where))
    .orderBy(asc(placements.plannedStart), asc(placements.id));
  return rows.map(({ mixCode, fcMPa, fcAgeDays, slumpType, siteWaterAllowedLPerM3, lowBleed, ...rest }) => {
    const { slumpTargetMm, slumpToleranceMm, airTargetPct, airTolerancePct, maxConcreteTempC, ...p } = rest;
    const mix =
      mixCode === null
        ? null
        : {
            code: mixCode,
            fcMPa: fcMPa!,
            fcAgeDays: fcAgeDays!,
            slumpType: slumpType!,
            siteWaterAllowedLPerM3: siteWaterAllowedLPerM3!,
            lowBleed: lowBleed!,
            slumpTargetMm,
            slumpToleranceMm,
            airTargetPct,
            airTolerancePct,
            maxConcreteTempC,
          };
    return { ...p, mix };
  });
}

const inDay = (col: PgColumn, range: { start: Date; end: Date }) => and(gte(col, range.start), lt(col, range.end))!;

export async function loadDigestDay(projectId: string, date: string, tx: Executor = db): Promise<DigestDay> {
  const [project] = await tx.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  const range = localDayRange(date, project.timeZone);
  const live = <T extends { projectId: PgColumn; deletedAt: PgColumn }>(t: T) => and(eq(t.projectId, projectId), isNull(t.deletedAt))!;

  const [dayPlacements, dayDeliveries, dayTests, dayWeather, daySets, dayBreaks, [diary], dayPhotos] = await Promise.all([
    loadPlacements(tx, projectId, inDay(placements.plannedStart, range)),
    tx.select().from(deliveries).where(and(live(deliveries), inDay(deliveries.arrivedAt, range))).orderBy(asc(deliveries.arrivedAt)),
    tx.select().from(fieldTests).where(and(live(fieldTests), inDay(fieldTests.sampledAt, range))).orderBy(asc(fieldTests.sampledAt)),
    tx.select().from(weatherObservations).where(and(live(weatherObservations), inDay(weatherObservations.observedAt, range))).orderBy(asc(weatherObservations.observedAt)),
    tx.select().from(specimenSets).where(and(live(specimenSets), inDay(specimenSets.castAt, range))).orderBy(asc(specimenSets.castAt)),
    tx
      .select({ b: breaks, setCode: specimenSets.setCode, placementId: specimenSets.placementId, cylinderDiameterMm: specimenSets.cylinderDiameterMm })
      .from(breaks)
      .innerJoin(specimenSets, and(eq(specimenSets.id, breaks.specimenSetId), eq(specimenSets.projectId, projectId)))
      .where(and(live(breaks), inDay(breaks.testedAt, range)))
      .orderBy(asc(breaks.testedAt)),
    tx.select().from(diaryEntries).where(and(live(diaryEntries), eq(diaryEntries.date, date))),
    tx.select().from(photos).where(and(live(photos), isNotNull(photos.storedAt), inDay(photos.takenAt, range))).orderBy(asc(photos.takenAt)),
  ]);

  const [crew, delays] = diary
    ? await Promise.all([
        tx.select().from(diaryCrew).where(and(live(diaryCrew), eq(diaryCrew.diaryEntryId, diary.id))).orderBy(asc(diaryCrew.createdAt)),
        tx.select().from(diaryDelays).where(and(live(diaryDelays), eq(diaryDelays.diaryEntryId, diary.id))).orderBy(asc(diaryDelays.createdAt)),
      ])
    : [[], []];

  const known = new Set(dayPlacements.map((p) => p.id));
  const referenced = [
    ...dayDeliveries.map((d) => d.placementId),
    ...dayTests.map((t) => t.placementId),
    ...dayWeather.map((w) => w.placementId),
    ...daySets.map((s) => s.placementId),
    ...dayBreaks.map((b) => b.placementId),
  ].filter((id): id is string => id !== null && !known.has(id));
  const otherPlacements = referenced.length ? await loadPlacements(tx, projectId, inArray(placements.id, [...new Set(referenced)])) : [];

  return {
    project,
    date,
    placements: dayPlacements,
    otherPlacements,
    deliveries: dayDeliveries,
    fieldTests: dayTests,
    weather: dayWeather,
    checks: await loadCheckDay(tx, project, date),
    specimenSets: daySets,
    breaks: dayBreaks.map(({ b, setCode, placementId, cylinderDiameterMm }) => ({ ...b, setCode, placementId, cylinderDiameterMm })),
    diary: diary ? { submitted: diary.submittedAt !== null, weatherSummary: diary.weatherSummary, workDone: diary.workDone, crew, delays } : null,
    photos: dayPhotos,
    site: await loadSiteStatus(tx, projectId, date),
  };
}
