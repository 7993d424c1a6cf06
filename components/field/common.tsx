"use client";

// Shared pieces of the field screens: the device database and project, unit conversion at the edge,
// times in the project's zone, and small touch-sized controls.
import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";
import { createContext, useContext } from "react";
import { can, type Action } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import { fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from "@/lib/concrete";
import { isLocalWriteError, listProjects, type ProjectRow } from "@/lib/sync/client";
import { useOptionalSyncDb } from "@/lib/sync/client/react";
import { addDays as addLocalDays, calendarDateText, deviceTimeZone, formatInstant, isTimeZone, localDate, localDateTime, localDateTimeToInstant } from "@/lib/time/zone";

export type FieldContextValue = { selectedProjectId: string | null; selectProject: (id: string | null) => void };
export const FieldContext = createContext<FieldContextValue>({ selectedProjectId: null, selectProject: () => {} });
export const useFieldContext = () => useContext(FieldContext);

/** The projects the user is on, as last pulled to this device (undefined while loading). */
export function useProjects(): ProjectRow[] | undefined {
  const db = useOptionalSyncDb();
  return useLiveQuery(async () => (db ? (await listProjects(db)).sort((a, b) => a.name.localeCompare(b.name)) : []), [db]);
}

export function useProject(projectId: string | null | undefined): ProjectRow | undefined {
  const projects = useProjects();
  return projects?.find((p) => p.id === projectId);
}

/** Whether the user's role on the project may write with `action` (the office may correct any unsigned record). */
export function mayWrite(project: ProjectRow | undefined, action: Action): boolean {
  const role = (project?.role ?? null) as ProjectRole | null;
  if (!role) return false;
  return can({ isAdmin: false }, action, role) || can({ isAdmin: false }, "record.correct", role);
}

export const unitSystemOf = (project: ProjectRow | undefined): UnitSystem => (project?.unitSystem === "IP" ? "IP" : "SI");

/** "YYYY-MM-DD" of an instant in a time zone (lib/time/zone: the one home of project-local time). */
export function dateInZone(instant: Date, timeZone: string): string {
  return isTimeZone(timeZone) ? localDate(instant, timeZone) : instant.toISOString().slice(0, 10);
}

export const addDays = addLocalDays;

export function formatTime(value: unknown, timeZone?: string): string {
  if (typeof value !== "string" || !value) return "—";
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return "—";
  try {
    return formatInstant(d, timeZone, "time");
  } catch {
    return d.toLocaleTimeString();
  }
}

export function formatDateTime(value: unknown, timeZone?: string): string {
  if (typeof value !== "string" || !value) return "—";
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return "—";
  try {
    return formatInstant(d, timeZone, "weekdayDayTime");
  } catch {
    return d.toLocaleString();
  }
}

// Inputs show and read times on the project's wall clock (lib/time/zone), whatever zone the
// device is set to; without a zone (screens not tied to a project) the device's clock is used.
const zoneOf = (timeZone?: string) => (timeZone && isTimeZone(timeZone) ? timeZone : deviceTimeZone());

/** A project-local calendar date (YYYY-MM-DD) in words: "Wed, Dec 2". */
export function formatDay(date: string): string {
  return calendarDateText(date, "shortDate");
}

/** Value for an <input type="datetime-local"> from an instant, on the project's wall clock. */
export function toLocalInput(value: Date | string | null | undefined, timeZone?: string): string {
  if (!value) return "";
  const d = typeof value === "string" ? new Date(value) : value;
  if (Number.isNaN(d.getTime())) return "";
  return localDateTime(d, zoneOf(timeZone));
}

/** Value for an <input type="time"> on the project's wall clock. */
export function toTimeInput(value: Date | string | null | undefined, timeZone?: string): string {
  return toLocalInput(value, timeZone).slice(11, 16);
}

/** A datetime-local value on the project's wall clock → ISO instant, or null when empty. */
export function fromLocalInput(value: string | undefined | null, timeZone?: string): string | null {
  if (!value) return null;
  return localDateTimeToInstant(value, zoneOf(timeZone))?.toISOString() ?? null;
}

/** A time typed on `baseDate` (YYYY-MM-DD) on the project's wall clock → ISO instant, or null when empty. */
export function fromTimeInput(time: string | undefined | null, baseDate: string, timeZone?: string): string | null {
  if (!time) return null;
  return fromLocalInput(`${baseDate}T${time}`, timeZone);
}

export function todayLocal(timeZone?: string): string {
  return localDate(new Date(), zoneOf(timeZone));
}

/** A typed number, or null when empty; NaN stays NaN so the schema names the field. */
export function parseNumber(text: string | undefined | null): number | null {
  if (text === undefined || text === null || text.trim() === "") return null;
  return Number(text.replace(",", "."));
}

/** Typed value in the project's units → SI (null when empty). */
export function toSI(quantity: Quantity, text: string | undefined, unitSystem: UnitSystem): number | null {
  const n = parseNumber(text);
  if (n === null || Number.isNaN(n)) return n;
  return fromDisplay(quantity, n, unitSystem);
}

/** Stored SI → text for an input in the project's units. */
export function fromSI(quantity: Quantity, value: unknown, unitSystem: UnitSystem, digits = 2): string {
  if (typeof value !== "number") return "";
  return String(Number(toDisplay(quantity, value, unitSystem).toFixed(digits)));
}

export { unitLabel };


/** The message and field messages of a refused local write. */
export function writeErrorOf(error: unknown): { message: string; fields: Record<string, string> } {
  if (isLocalWriteError(error)) return { message: error.message, fields: error.fields ?? {} };
  return { message: error instanceof Error ? error.message : "Could not save on this device.", fields: {} };
}

/** Orders records by one of their instants (ISO strings sort in time order; a missing one first). */
export const byTime =
  <K extends string>(field: K) =>
  (a: { [F in K]?: string | null }, b: { [F in K]?: string | null }) =>
    (a[field] ?? "").localeCompare(b[field] ?? "");

/** A small verdict beside a value: words + icon + colour. */
export function Verdict({ ok, okText = "In tolerance", badText = "Out of tolerance", testId }: { ok: boolean; okText?: string; badText?: string; testId?: string }) {
  // The colours and icons of the vocabulary: a pass in the done tone, a failure as a warning.
  const word = ok ? { tone: "done" as const, icon: "circle-check" as const } : SEVERITY_WORDS.warning;
  return (
    <span
      data-testid={testId}
      data-ok={ok ? "yes" : "no"}
      data-tone={word.tone}
      className={clsx("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold", TONES[word.tone].className)}
    >
      <VocabularyIcon name={word.icon} />
      {ok ? okText : badText}
    </span>
  );
}

/** A caution in words, with the vocabulary's caution colour and icon. */
export function CautionBadge({ children, testId }: { children: React.ReactNode; testId?: string }) {
  const word = SEVERITY_WORDS.caution;
  return (
    <span data-testid={testId} data-tone={word.tone} className={clsx("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold", TONES[word.tone].className)}>
      <VocabularyIcon name={word.icon} />
      {children}
    </span>
  );
}

export { Section } from "./section";

/** A datetime or time input with a big "Now" button beside it. */
export function NowInput({
  label,
  value,
  onChange,
  type = "time",
  error,
  testId,
  timeZone,
  hint,
}: {
  timeZone?: string;
  hint?: React.ReactNode;
  label: string;
  value: string;
  onChange: (value: string) => void;
  type?: "time" | "datetime-local";
  error?: string;
  testId?: string;
}) {
  const now = () => onChange(type === "time" ? toTimeInput(new Date(), timeZone) : toLocalInput(new Date(), timeZone));
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label className="text-sm font-semibold text-ink-800">
        {label}
        <div className="mt-1 flex gap-2">
          <input
            type={type}
            value={value}
            data-testid={testId}
            aria-invalid={error ? true : undefined}
            onChange={(e) => onChange(e.target.value)}
            className={clsx(
              "min-h-touch w-full min-w-0 rounded-lg border bg-white px-3 text-base font-normal text-ink-950",
              error ? "border-danger-600" : "border-ink-300",
            )}
          />
          <button
            type="button"
            onClick={now}
            data-testid={testId ? `${testId}-now` : undefined}
            className="min-h-touch shrink-0 rounded-lg border border-ink-300 bg-white px-3 text-base font-semibold text-ink-900 hover:bg-ink-50"
          >
            Now
          </button>
        </div>
      </label>
      {hint ?? (type === "datetime-local" && timeZone ? <ZoneHint value={value} timeZone={timeZone} /> : null)}
      {error ? (
        <p className="text-sm font-medium text-danger-700" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** The instant a datetime-local value names on the project's clock, with the zone's abbreviation (CDT or CST on a change night). */
function ZoneHint({ value, timeZone }: { value: string; timeZone: string }) {
  const at = fromLocalInput(value, timeZone);
  if (!at) return null;
  const text = formatInstant(at, timeZone, "weekdayDayTimeZone");
  return <p className="text-sm text-muted">{text} (project time)</p>;
}
