// The server's stored findings: after every write that can change what a day's records mean, the
// rulebook judges those days again and the stored rows are replaced, in the same transaction.
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Executor } from "@/db";
import { breaks, checkFindings, placements, weatherObservations } from "@/db/schema";
import { attention, type Finding } from "@/lib/checks";
import { addDays, localDate } from "@/lib/time/zone";
import { TRUCK_TIMES, dayFindings, loadCheckDay, loadProject } from "./load";

type Row = Record<string, unknown>;
type Project = Awaited<ReturnType<typeof loadProject>>;

/** Judges each date again and replaces its stored findings. */
export async function refreshFindings(tx: Executor, projectId: string, dates: Iterable<string>): Promise<void> {
  const unique = [...new Set(dates)];
  if (unique.length === 0) return;
  const project = await loadProject(tx, projectId);
  await tx.delete(checkFindings).where(and(eq(checkFindings.projectId, projectId), inArray(checkFindings.localDate, unique)));
  const rows = [];
  for (const date of unique) {
    for (const f of attention(dayFindings(await loadCheckDay(tx, project, date), date))) rows.push(findingRow(projectId, date, f));
  }
  if (rows.length) await tx.insert(checkFindings).values(rows);
}

export type FindingRow = typeof checkFindings.$inferInsert;

/** A finding as its stored row on a project-local day. */
export function findingRow(projectId: string, localDate: string, f: Finding): FindingRow {
  return {
    projectId,
    placementId: f.placementId,
    localDate,
    rule: f.rule,
    severity: f.severity,
    subjectType: f.subject.type,
    subjectId: f.subject.id,
    title: f.title,
    message: f.message,
    appliedValue: f.applied.value,
    appliedLimit: f.applied.limit,
    appliedUnit: f.applied.unit,
    source: f.source,
  };
}

const when = (v: unknown) => (v instanceof Date ? v : v ? new Date(String(v)) : null);

async function datesOfPlacements(tx: Executor, project: Project, placementIds: string[]): Promise<string[]> {
  if (placementIds.length === 0) return [];
  const tz = project.timeZone;
  // One statement: the times of the placements and of every live record under them.
  const ids = `{${placementIds.join(",")}}`;
  const result = await tx.execute(sql`
    select planned_start as at from placements where id = any(${ids}::uuid[])
    union all select unnest(array[arrived_at, discharge_finished_at, water_first_at, water_last_at]) from deliveries
      where placement_id = any(${ids}::uuid[]) and deleted_at is null
    union all select sampled_at from field_tests where placement_id = any(${ids}::uuid[]) and deleted_at is null
    union all select observed_at from weather_observations where placement_id = any(${ids}::uuid[]) and deleted_at is null
    union all select read_at from curing_readings where placement_id = any(${ids}::uuid[]) and deleted_at is null
    union all select b.tested_at from breaks b join specimen_sets s on s.id = b.specimen_set_id
      where s.placement_id = any(${ids}::uuid[]) and b.deleted_at is null`);
  return (result.rows as { at: Date | string | null }[]).filter((r) => r.at !== null).map((r) => localDate(new Date(r.at!), tz));
}

/** The planned days of the rows' placements: whether cylinders were made is judged on that day. */
async function plannedDates(tx: Executor, project: Project, rows: Row[]): Promise<string[]> {
  const ids = [...new Set(rows.map((r) => r.placementId).filter((id): id is string => typeof id === "string"))];
  if (ids.length === 0) return [];
  const found = await tx.select({ at: placements.plannedStart }).from(placements).where(inArray(placements.id, ids));
  return found.map((p) => localDate(p.at, project.timeZone));
}

/**
 * The project-local dates whose findings a write to these rows (before and after) can change. A
 * placement or mix change reaches every day of its records; a break, every day its set was broken.
 */
export async function datesAffected(tx: Executor, projectId: string, type: string, rows: Row[]): Promise<string[]> {
  const project = await loadProject(tx, projectId);
  const tz = project.timeZone;
  const at = (...fields: string[]) =>
    rows.flatMap((r) => fields.map((field) => when(r[field]))).filter((d): d is Date => d !== null).map((d) => localDate(d, tz));
  switch (type) {
    case "weather-observations": {
      const days = at("observedAt");
      // A reading can end or start a run of cold days (ACI 306.1-90): the three days after it too.
      return project.coldWeatherDefinition === "aci306-1990" ? days.flatMap((d) => [d, addDays(d, 1), addDays(d, 2), addDays(d, 3)]) : days;
    }
    case "deliveries":
      // The days lib/findings/load.ts reads a truck on (a night pour's discharge is after midnight),
      // and its placement's planned day, where whether cylinders were made is judged.
      return [...at(...TRUCK_TIMES), ...(await plannedDates(tx, project, rows))];
    case "field-tests":
      return at("sampledAt");
    case "curing-readings":
      return at("readAt");
    case "breaks":
    case "specimen-sets": {
      const setIds = [...new Set(rows.map((r) => String(type === "breaks" ? r.specimenSetId : r.id)))];
      const broken = await tx.select({ at: breaks.testedAt }).from(breaks).where(inArray(breaks.specimenSetId, setIds));
      return [...at("testedAt"), ...broken.map((b) => localDate(b.at, tz)), ...(type === "specimen-sets" ? await plannedDates(tx, project, rows) : [])];
    }
    case "placements":
      return datesOfPlacements(tx, project, [...new Set(rows.map((r) => String(r.id)))]);
    case "mix-designs": {
      const mixIds = [...new Set(rows.map((r) => String(r.id)))];
      const using = await tx.select({ id: placements.id }).from(placements).where(and(eq(placements.projectId, projectId), inArray(placements.mixId, mixIds)));
      return datesOfPlacements(tx, project, using.map((p) => p.id));
    }
    default:
      return [];
  }
}

/** After a write of `type`: judge again every day the rows (before and after the write) touch. */
export async function refreshAfterWrite(tx: Executor, projectId: string, type: string, rows: (Row | null)[]): Promise<void> {
  const present = rows.filter((r): r is Row => r !== null);
  await refreshFindings(tx, projectId, await datesAffected(tx, projectId, type, present));
}

/** Every date with records of the project: for a change of the project's own settings. */
export async function refreshProject(tx: Executor, projectId: string): Promise<void> {
  const project = await loadProject(tx, projectId);
  const ids = await tx.select({ id: placements.id }).from(placements).where(eq(placements.projectId, projectId));
  const site = await tx
    .select({ at: weatherObservations.observedAt })
    .from(weatherObservations)
    .where(and(eq(weatherObservations.projectId, projectId), isNull(weatherObservations.placementId)));
  const stored = await tx.select({ date: sql<string>`distinct ${checkFindings.localDate}` }).from(checkFindings).where(eq(checkFindings.projectId, projectId));
  const dates = [
    ...(await datesOfPlacements(tx, project, ids.map((p) => p.id))),
    ...site.map((w) => localDate(w.at, project.timeZone)),
    ...stored.map((s) => s.date),
  ];
  await refreshFindings(tx, projectId, dates);
}
