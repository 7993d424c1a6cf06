// The visit report's rules, without React: which fields it has, how its stored instants read on the
// project's wall clock (lib/time/zone, never the device's clock), which projects a person may start a
// visit on (lib/auth/can), and how a finding names the placement it concerns.
import { can } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import { chainWallTimes, isLocalDate, isTimeZone, localDate, localDateTime } from "@/lib/time/zone";
import { elementTypeLabel } from "@/lib/ui/vocabulary";

export const REPORT_FIELDS = [
  ["areasInspected", "Areas inspected"],
  ["elementsInspected", "Elements inspected"],
  ["testsWitnessed", "Tests witnessed"],
  ["weather", "Weather"],
  ["notes", "Notes"],
] as const;

export type ReportValues = Record<"visitDate" | "arrived" | "left" | (typeof REPORT_FIELDS)[number][0], string>;

const text = (v: unknown) => (typeof v === "string" ? v : "");

/** "HH:MM" of a stored instant on the project's clock; "" when there is none. */
export function timeOnSite(instant: unknown, timeZone: string): string {
  const d = typeof instant === "string" && instant ? new Date(instant) : null;
  if (!d || Number.isNaN(d.getTime()) || !isTimeZone(timeZone)) return "";
  return localDateTime(d, timeZone).slice(11, 16);
}

/** The form's values of a stored visit, times on the project's clock. */
export function reportValues(visit: Record<string, unknown>, timeZone: string): ReportValues {
  return {
    visitDate: text(visit.visitDate),
    arrived: timeOnSite(visit.arrivedAt, timeZone),
    left: timeOnSite(visit.leftAt, timeZone),
    ...(Object.fromEntries(REPORT_FIELDS.map(([k]) => [k, text(visit[k])])) as Record<(typeof REPORT_FIELDS)[number][0], string>),
  };
}

/**
 * The patch a saved form writes: the typed times become instants on the visit's date in the project's
 * zone; a "to" earlier than "from" is the next morning (a night pour's visit), as on a truck ticket.
 */
export function reportPatch(values: ReportValues, timeZone: string): Record<string, string | null> {
  const { arrived, left, ...rest } = values;
  const [arrivedAt, leftAt] = isLocalDate(values.visitDate) ? chainWallTimes(values.visitDate, [arrived, left], timeZone) : [null, null];
  return { ...rest, arrivedAt: arrivedAt?.toISOString() ?? null, leftAt: leftAt?.toISOString() ?? null };
}

/** Today's date where the project is (a new visit's date), whatever zone the device is set to. */
export const projectToday = (timeZone: string, now: Date = new Date()) => localDate(now, timeZone);

/** The projects a person may start a visit report on: their role there may write visits. */
export function visitProjects<P extends { role?: string | null }>(projects: readonly P[]): P[] {
  return projects.filter((p) => can({ isAdmin: false }, "visit.write", (p.role ?? null) as ProjectRole | null));
}

/** The project a new visit starts on: the one shown if the person may write there, else the only one. */
export function preselectedProject(writable: readonly { id: string }[], shownId: string | null): string {
  if (shownId && writable.some((p) => p.id === shownId)) return shownId;
  return writable.length === 1 ? writable[0].id : "";
}

/** "Level 2 deck, pour 3 (Elevated slab)": how a finding names the placement it concerns. */
export function placementName(placement: Record<string, unknown> | undefined): string {
  if (!placement) return "A placement not on this device";
  const element = text(placement.element) || "Placement";
  return placement.elementType ? `${element} (${elementTypeLabel(placement.elementType)})` : element;
}
