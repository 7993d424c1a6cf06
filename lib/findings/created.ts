// The stored findings of records created set-based (the sync push's runs of creates). A new truck
// or curing reading is judged on its own (lib/checks JUDGED_ONE_BY_ONE): a push of 100 trucks reads
// their placements and mixes once instead of every record of every day they fall on, which grew
// with the day (a placement's planned day reads all its trucks). Any other kind, or new rows that
// produce a finding about something else, leave the caller to judge their days again (store.ts).
// Creates only: an update or a delete can also take a finding away, which only a day's judgement sees.
import { and, eq, inArray } from "drizzle-orm";
import type { Executor } from "@/db";
import { mixDesigns, type projects } from "@/db/schema";
import { JUDGED_ONE_BY_ONE, evaluate, attention, toCheckInput } from "@/lib/checks";
import { localDate } from "@/lib/time/zone";
import { TRUCK_TIMES } from "./load";
import { findingRow, type FindingRow } from "./store";

type Row = Record<string, unknown>;
type Project = typeof projects.$inferSelect;
export type Placements = { placements: Row[]; mixes: Row[] };

/** The part of the rulebook's input each record type fills. */
const INPUT_OF: Record<string, keyof typeof JUDGED_ONE_BY_ONE> = { deliveries: "deliveries", "curing-readings": "curing" };

export const judgedOneByOne = (type: string) => type in INPUT_OF;

/** The rows' placements (as the caller read them) with their mixes, read in one statement if any. */
export async function withMixes(tx: Executor, projectId: string, placementRows: Row[]): Promise<Placements> {
  const mixIds = [...new Set(placementRows.map((p) => p.mixId).filter((id): id is string => typeof id === "string"))];
  const mixes = mixIds.length ? await tx.select().from(mixDesigns).where(and(eq(mixDesigns.projectId, projectId), inArray(mixDesigns.id, mixIds))) : [];
  return { placements: placementRows, mixes };
}

/**
 * The stored rows of the findings of new `rows` of `type`, judged on their own, each on the day the
 * day loader would store it (a truck is read on the days of its times and on its placement's planned
 * day: lib/findings/load.ts). Null when the type is not judged one by one, or when the new rows
 * produce a finding about anything but themselves (a placement with no cylinders): the days are then
 * judged whole, since that finding counts records the rows alone do not show.
 */
export function judgeNewRows(project: Project, type: string, rows: Row[], around: Placements): FindingRow[] | null {
  const key = INPUT_OF[type];
  if (!key) return null;
  const input = toCheckInput({ project, ...around, [key]: rows });
  const subject = JUDGED_ONE_BY_ONE[key];
  const byId = new Map(rows.map((r) => [String(r.id), r]));
  const findings = evaluate(input);
  if (findings.some((f) => f.subject.type !== subject || !byId.has(f.subject.id))) return null;
  const tz = project.timeZone;
  const planned = new Map(input.placements.map((p) => [p.id, localDate(p.plannedStart, tz)]));
  const on = (value: unknown) => (value instanceof Date || typeof value === "string" ? [localDate(new Date(value), tz)] : []);
  const daysRead = (row: Row) => {
    if (key === "curing") return on(row.readAt);
    const plannedDay = planned.get(String(row.placementId));
    return [...TRUCK_TIMES.flatMap((field) => on(row[field])), ...(plannedDay ? [plannedDay] : [])];
  };
  return attention(findings).flatMap((f) => {
    const date = localDate(new Date(f.at), tz);
    return daysRead(byId.get(f.subject.id)!).includes(date) ? [findingRow(project.id, date, f)] : [];
  });
}
