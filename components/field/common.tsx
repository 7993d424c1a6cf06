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
import { isLocalWriteError, listProjects, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useOptionalSyncDb } from "@/lib/sync/client/react";

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

/** "YYYY-MM-DD" of an instant in a time zone. */
export function dateInZone(instant: Date, timeZone: string): string {
  try {
    return new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(instant);
  } catch {
    return instant.toISOString().slice(0, 10);
  }
}

export function addDays(isoDate: string, days: number): string {
  const d = new Date(`${isoDate}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

export function formatTime(value: unknown, timeZone?: string): string {
  if (typeof value !== "string" || !value) return "—";
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return "—";
  try {
    return new Intl.DateTimeFormat("en-US", { hour: "numeric", minute: "2-digit", timeZone }).format(d);
  } catch {
    return d.toLocaleTimeString();
  }
}

export function formatDateTime(value: unknown, timeZone?: string): string {
  if (typeof value !== "string" || !value) return "—";
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return "—";
  try {
    return new Intl.DateTimeFormat("en-US", { weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit", timeZone }).format(d);
  } catch {
    return d.toLocaleString();
  }
}

/** Value for an <input type="datetime-local"> from an instant (device time). */
export function toLocalInput(value: Date | string | null | undefined): string {
  if (!value) return "";
  const d = typeof value === "string" ? new Date(value) : value;
  if (Number.isNaN(d.getTime())) return "";
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Value for an <input type="time"> (device time). */
export function toTimeInput(value: Date | string | null | undefined): string {
  return toLocalInput(value).slice(11, 16);
}

/** A datetime-local value → ISO instant, or null when empty. */
export function fromLocalInput(value: string | undefined | null): string | null {
  if (!value) return null;
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? null : d.toISOString();
}

/** A time typed on `baseDate` (YYYY-MM-DD, device time) → ISO instant, or null when empty. */
export function fromTimeInput(time: string | undefined | null, baseDate: string): string | null {
  if (!time) return null;
  return fromLocalInput(`${baseDate}T${time}`);
}

export function todayLocal(): string {
  return toLocalInput(new Date()).slice(0, 10);
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

export const num = (value: unknown): number | undefined => (typeof value === "number" && Number.isFinite(value) ? value : undefined);
export const str = (value: unknown): string => (typeof value === "string" ? value : "");

/** The message and field messages of a refused local write. */
export function writeErrorOf(error: unknown): { message: string; fields: Record<string, string> } {
  if (isLocalWriteError(error)) return { message: error.message, fields: error.fields ?? {} };
  return { message: error instanceof Error ? error.message : "Could not save on this device.", fields: {} };
}

export const byTime = (field: string) => (a: LocalRecord, b: LocalRecord) => str(a[field]).localeCompare(str(b[field]));

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

export function Section({ title, children, testId, actions }: { title: string; children: React.ReactNode; testId?: string; actions?: React.ReactNode }) {
  return (
    <section className="card p-4" data-testid={testId} aria-label={title}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-xl font-bold text-ink-950">{title}</h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

/** A datetime or time input with a big "Now" button beside it. */
export function NowInput({
  label,
  value,
  onChange,
  type = "time",
  error,
  testId,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  type?: "time" | "datetime-local";
  error?: string;
  testId?: string;
}) {
  const now = () => onChange(type === "time" ? toTimeInput(new Date()) : toLocalInput(new Date()));
  return (
    <div className="flex flex-col gap-1">
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
      {error ? (
        <p className="text-sm font-medium text-danger-700" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}
