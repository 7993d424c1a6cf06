// Times on the field screens in the project's zone: display text and the values of date/time inputs
// (lib/time/zone is the one home of project-local time; these are its edges for forms).
import { addDays as addLocalDays, calendarDateText, deviceTimeZone, formatInstant, isTimeZone, localDate, localDateTime, localDateTimeToInstant } from "@/lib/time/zone";

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
