// What the rulebook reads for one project-local day, from PostgreSQL: the day's trucks, tests,
// weather, curing readings and breaks, with the placements and mixes they belong to. The digest, the
// PDF and the stored findings all read a day through this one loader, so they judge the same records.
import { and, eq, gte, inArray, isNull, lt, or } from "drizzle-orm";
import type { PgColumn } from "drizzle-orm/pg-core";
import type { Executor } from "@/db";
import { breaks, curingReadings, deliveries, fieldTests, mixDesigns, placements, projects, specimenSets, weatherObservations } from "@/db/schema";
import { evaluate, onDate, toCheckInput, type CheckInput, type Finding } from "@/lib/checks";
import { notFound } from "@/lib/errors";
import { addDays, localDayRange } from "@/lib/time/zone";

type Project = typeof projects.$inferSelect;

const inRange = (col: PgColumn, range: { start: Date; end: Date }) => and(gte(col, range.start), lt(col, range.end))!;

/**
 * The times a truck is read on: it belongs to every project-local day one of them falls on (a night
 * pour's discharge end is after midnight), besides its placement's planned day.
 */
export const TRUCK_TIMES = ["arrivedAt", "dischargeFinishedAt", "waterFirstAt", "waterLastAt"] as const;

export async function loadProject(tx: Executor, projectId: string): Promise<Project> {
  const [project] = await tx.select().from(projects).where(eq(projects.id, projectId));
  if (!project) throw notFound("Project");
  return project;
}

/**
 * The records the rulebook needs to judge `date`: the day's own records, the three days of weather
 * before it where the project uses the ACI 306.1-90 definition (a run of days decides it), and every
 * break of a specimen set broken that day (cylinders are counted into tests per set and age), and
 * every truck and specimen set of a placement planned that day (whether cylinders were made).
 */
export async function loadCheckDay(tx: Executor, project: Project, date: string): Promise<CheckInput> {
  const projectId = project.id;
  const day = localDayRange(date, project.timeZone);
  const weatherFrom = project.coldWeatherDefinition === "aci306-1990" ? localDayRange(addDays(date, -3), project.timeZone).start : day.start;
  const live = <T extends { projectId: PgColumn; deletedAt: PgColumn }>(t: T) => and(eq(t.projectId, projectId), isNull(t.deletedAt))!;

  // One after another: inside a transaction the statements share one connection.
  // A truck's findings are dated by its discharge end or its last water, which a night pour puts on the
  // day after its arrival: a truck belongs to every day one of those times falls on.
  const truckTimes = TRUCK_TIMES.map((field) => deliveries[field]);
  const dayDeliveries = await tx.select().from(deliveries).where(and(live(deliveries), or(...truckTimes.map((col) => inRange(col, day)))));
  const dayTests = await tx.select().from(fieldTests).where(and(live(fieldTests), inRange(fieldTests.sampledAt, day)));
  const dayWeather = await tx
    .select()
    .from(weatherObservations)
    .where(and(live(weatherObservations), inRange(weatherObservations.observedAt, { start: weatherFrom, end: day.end })));
  const dayCuring = await tx.select().from(curingReadings).where(and(live(curingReadings), inRange(curingReadings.readAt, day)));
  const brokenSets = await tx.selectDistinct({ id: breaks.specimenSetId }).from(breaks).where(and(live(breaks), inRange(breaks.testedAt, day)));
  const setIds = brokenSets.map((s) => s.id);
  const sets = setIds.length ? await tx.select().from(specimenSets).where(and(live(specimenSets), inArray(specimenSets.id, setIds))) : [];
  const setBreaks = setIds.length ? await tx.select().from(breaks).where(and(live(breaks), inArray(breaks.specimenSetId, setIds))) : [];
  const referenced = [...dayDeliveries, ...dayTests, ...dayWeather, ...dayCuring, ...sets]
    .map((r) => r.placementId)
    .filter((id): id is string => id !== null);
  const dayPlacements = await tx
    .select()
    .from(placements)
    .where(and(live(placements), or(inRange(placements.plannedStart, day), referenced.length ? inArray(placements.id, [...new Set(referenced)]) : undefined)));
  // A placement planned today is judged whole for what it lacks (no cylinders): all its trucks and sets.
  const plannedIds = dayPlacements.filter((p) => p.plannedStart >= day.start && p.plannedStart < day.end).map((p) => p.id);
  const dayIds = new Set(dayDeliveries.map((d) => d.id));
  const plannedDeliveries = plannedIds.length
    ? (await tx.select().from(deliveries).where(and(live(deliveries), inArray(deliveries.placementId, plannedIds)))).filter((d) => !dayIds.has(d.id))
    : [];
  const setIdSet = new Set(setIds);
  const plannedSets = plannedIds.length
    ? (await tx.select().from(specimenSets).where(and(live(specimenSets), inArray(specimenSets.placementId, plannedIds)))).filter((s) => !setIdSet.has(s.id))
    : [];
  const mixIds = [...new Set(dayPlacements.map((p) => p.mixId).filter((id): id is string => id !== null))];
  const mixes = mixIds.length ? await tx.select().from(mixDesigns).where(and(eq(mixDesigns.projectId, projectId), inArray(mixDesigns.id, mixIds))) : [];
  return toCheckInput({
    project,
    mixes,
    placements: dayPlacements,
    deliveries: [...dayDeliveries, ...plannedDeliveries],
    fieldTests: dayTests,
    weather: dayWeather,
    curing: dayCuring,
    specimenSets: [...sets, ...plannedSets],
    breaks: setBreaks,
  });
}

/** Every finding of one project-local day, information included. */
export function dayFindings(input: CheckInput, date: string): Finding[] {
  return onDate(evaluate(input), date, input.project.timeZone);
}
