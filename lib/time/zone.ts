// Project-local time: calendar dates and wall-clock hours in the project's time zone, turned into
// instants with the Intl time-zone data (daylight-saving changes included). Pure: no imports, no clock.

const DAY_MS = 86_400_000;
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-US", {
      timeZone,
      hourCycle: "h23",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
    });
    formatters.set(timeZone, f);
  }
  return f;
}

export type WallClock = { year: number; month: number; day: number; hour: number; minute: number; second: number };

/** The wall clock in `timeZone` at `instant`. */
export function zonedParts(instant: Date, timeZone: string): WallClock {
  const parts = formatter(timeZone).formatToParts(instant);
  const get = (type: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === type)!.value);
  return { year: get("year"), month: get("month"), day: get("day"), hour: get("hour"), minute: get("minute"), second: get("second") };
}

/** Offset of the zone from UTC at `instant`, in ms (Chicago in winter: −6 h). */
function offsetMs(instant: Date, timeZone: string): number {
  const p = zonedParts(instant, timeZone);
  const asUtc = Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second);
  return asUtc - Math.floor(instant.getTime() / 1000) * 1000;
}

const pad = (n: number, width = 2) => String(n).padStart(width, "0");

export function isLocalDate(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const [y, m, d] = value.split("-").map(Number);
  const t = new Date(Date.UTC(y, m - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
}

export function isTimeZone(value: string): boolean {
  try {
    formatter(value);
    return true;
  } catch {
    return false;
  }
}

/** The calendar date (YYYY-MM-DD) in `timeZone` at `instant`. */
export function localDate(instant: Date, timeZone: string): string {
  const p = zonedParts(instant, timeZone);
  return `${pad(p.year, 4)}-${pad(p.month)}-${pad(p.day)}`;
}

/** A calendar date moved by whole days (no time zone involved). */
export function addDays(date: string, days: number): string {
  const [y, m, d] = date.split("-").map(Number);
  const t = new Date(Date.UTC(y, m - 1, d) + days * DAY_MS);
  return `${pad(t.getUTCFullYear(), 4)}-${pad(t.getUTCMonth() + 1)}-${pad(t.getUTCDate())}`;
}

/**
 * The instant at which the wall clock in `timeZone` shows `hour`:00 on `date`. An hour that occurs
 * twice (clocks set back) is its first occurrence; an hour skipped (clocks set forward) becomes the
 * same number of minutes after the change (02:00 on a spring-forward night in Chicago → 03:00 CDT).
 */
export function zonedTimeToInstant(date: string, hour: number, timeZone: string): Date {
  if (!isLocalDate(date)) throw new RangeError(`Not a calendar date: ${date}`);
  if (!Number.isInteger(hour) || hour < 0 || hour > 23) throw new RangeError(`Not an hour of the day: ${hour}`);
  const [y, m, d] = date.split("-").map(Number);
  const { instants } = wallClockInstants({ year: y, month: m, day: d, hour, minute: 0, second: 0 }, timeZone);
  // No match: the hour does not exist that day; the offset before the change moves it forward.
  const wall = Date.UTC(y, m - 1, d, hour);
  return new Date(instants[0] ?? wall - offsetMs(new Date(wall - DAY_MS), timeZone));
}

/** The instants [start, end) of a project-local calendar day (23 or 25 hours on a change day). */
export function localDayRange(date: string, timeZone: string): { start: Date; end: Date } {
  return { start: zonedTimeToInstant(date, 0, timeZone), end: zonedTimeToInstant(addDays(date, 1), 0, timeZone) };
}

/**
 * Every instant at which the wall clock in `timeZone` shows `wall` (ms since epoch, earliest first):
 * one normally, two in the hour repeated when clocks go back, none in the hour skipped when they go
 * forward (a logger's local-time record across a change, lib/maturity/csv-import).
 */
export function wallClockInstants(wall: WallClock, timeZone: string): { instants: number[] } {
  const asUtc = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
  // The offsets in force a day either side cover any single change of offset around this time.
  const before = offsetMs(new Date(asUtc - DAY_MS), timeZone);
  const after = offsetMs(new Date(asUtc + DAY_MS), timeZone);
  const instants = [...new Set([before, after])]
    .map((offset) => asUtc - offset)
    .filter((t) => {
      const p = zonedParts(new Date(t), timeZone);
      return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) === asUtc;
    })
    .sort((a, b) => a - b);
  return { instants };
}

/** "HH:MM" on the wall clock in `timeZone` at `instant` (24-hour). */
export function localTimeOfDay(instant: Date, timeZone: string): string {
  const p = zonedParts(instant, timeZone);
  return `${pad(p.hour)}:${pad(p.minute)}`;
}

/** "YYYY-MM-DDTHH:MM" (a datetime-local input's value) in `timeZone` at `instant`. */
export function localDateTime(instant: Date, timeZone: string): string {
  return `${localDate(instant, timeZone)}T${localTimeOfDay(instant, timeZone)}`;
}

function parseClock(time: string): { hour: number; minute: number } | null {
  const m = /^(\d{2}):(\d{2})$/.exec(time);
  if (!m) return null;
  const hour = Number(m[1]);
  const minute = Number(m[2]);
  return hour <= 23 && minute <= 59 ? { hour, minute } : null;
}

/**
 * Every instant at which the wall clock in `timeZone` shows `time` ("HH:MM") on `date`: one
 * normally, two in the hour repeated when clocks go back; in the hour skipped when they go forward,
 * the one instant the same number of minutes after the change (02:30 → 03:30 CDT in Chicago).
 */
export function wallTimeInstants(date: string, time: string, timeZone: string): Date[] {
  const clock = parseClock(time);
  if (!isLocalDate(date) || !clock) return [];
  const [year, month, day] = date.split("-").map(Number);
  const { instants } = wallClockInstants({ year, month, day, hour: clock.hour, minute: clock.minute, second: 0 }, timeZone);
  if (instants.length) return instants.map((t) => new Date(t));
  const wall = Date.UTC(year, month - 1, day, clock.hour, clock.minute);
  return [new Date(wall - offsetMs(new Date(wall - DAY_MS), timeZone))];
}

/** A datetime-local value ("YYYY-MM-DDTHH:MM") read on the wall clock of `timeZone`; the first occurrence when it repeats. */
export function localDateTimeToInstant(value: string, timeZone: string): Date | null {
  const [date, time] = value.split("T");
  return wallTimeInstants(date ?? "", (time ?? "").slice(0, 5), timeZone)[0] ?? null;
}

/**
 * Clock times written in the order they happened (a truck ticket: batch, arrival, discharge start,
 * end), read from `date` in `timeZone`. Each time is the first instant, on its day or a later one,
 * that is not before the time before it: 23:05 then 00:50 is 00:50 the next day, and on the night
 * clocks go back 01:50 CDT then 01:10 is 01:10 CST, the same night. Blank times stay null and do not
 * move the chain.
 */
export function chainWallTimes(date: string, times: (string | null | undefined)[], timeZone: string): (Date | null)[] {
  let previous: Date | null = null;
  let day = date;
  return times.map((time) => {
    if (!time || !parseClock(time)) return null;
    for (let step = 0; step < 2; step += 1) {
      const found = wallTimeInstants(day, time, timeZone).find((t) => !previous || t.getTime() >= previous.getTime());
      if (found) {
        previous = found;
        return found;
      }
      day = addDays(day, 1);
    }
    return null;
  });
}

/**
 * The day a new ticket's first time is read on, when the person has not chosen one: today in the
 * zone, unless that puts the first time after `now` (a night pour logged at 00:50 whose truck
 * was batched at 23:05), in which case the day before.
 */
export function chainStartDate(times: (string | null | undefined)[], timeZone: string, now: Date): string {
  const today = localDate(now, timeZone);
  // Only the first time decides: a later time still in the future is a mistake to refuse, not a date to guess.
  const first = chainWallTimes(today, times, timeZone).find((t): t is Date => t !== null);
  return first && first.getTime() > now.getTime() ? addDays(today, -1) : today;
}

/**
 * The ways the app writes an instant for people, each in the project's zone (US English):
 * time "7:05 AM"; weekdayTime "Tue 7:05 AM"; dayHour "Nov 17, 7 AM"; dayTime "Nov 17, 7:05 AM";
 * weekdayDayTime "Tue, Nov 17, 7:05 AM"; yearDayTime "Nov 17, 2026, 7:05 AM"; weekdayDate
 * "Tue, Nov 17, 2026"; longDay "Tuesday, November 17"; a "Zone" suffix adds the zone's short name.
 */
const STYLES = {
  time: { hour: "numeric", minute: "2-digit" },
  weekdayTime: { weekday: "short", hour: "numeric", minute: "2-digit" },
  dayHour: { month: "short", day: "numeric", hour: "numeric" },
  dayTime: { month: "short", day: "numeric", hour: "numeric", minute: "2-digit" },
  weekdayDayTime: { weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit" },
  weekdayDayTimeZone: { weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit", timeZoneName: "short" },
  yearDayTime: { month: "short", day: "numeric", year: "numeric", hour: "numeric", minute: "2-digit" },
  yearDayTimeZone: { year: "numeric", month: "short", day: "numeric", hour: "numeric", minute: "2-digit", timeZoneName: "short" },
  weekdayDate: { weekday: "short", month: "short", day: "numeric", year: "numeric" },
  shortDate: { weekday: "short", month: "short", day: "numeric" },
  longDay: { weekday: "long", month: "long", day: "numeric" },
  longDate: { weekday: "long", month: "long", day: "numeric", year: "numeric" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;
export type InstantStyle = keyof typeof STYLES;

const styled = new Map<string, Intl.DateTimeFormat>();

/** `instant` written in `style` on the wall clock of `timeZone` (the device's own zone when undefined). */
export function formatInstant(instant: Date | string | number, timeZone: string | undefined, style: InstantStyle): string {
  const key = `${style}|${timeZone ?? ""}`;
  let f = styled.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat("en-US", { ...STYLES[style], timeZone });
    styled.set(key, f);
  }
  return f.format(instant instanceof Date ? instant : new Date(instant));
}

/** formatInstant with the zone and style fixed, for a screen that writes many instants alike. */
export function instantFormatter(timeZone: string | undefined, style: InstantStyle): { format: (instant: Date | string | number) => string } {
  return { format: (instant) => formatInstant(instant, timeZone, style) };
}

/** The device's own time zone (a default for a new project, the field screens' fallback). */
export function deviceTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone;
}

/** A calendar date (YYYY-MM-DD, no time or zone: a due date) in `style`: by default "Tue, Nov 17, 2026". */
export function calendarDateText(date: string, style: "weekdayDate" | "shortDate" | "longDay" | "longDate" = "weekdayDate"): string {
  if (!isLocalDate(date)) return date;
  // Noon UTC of that date names the same calendar day everywhere the formatter is told UTC.
  return formatInstant(`${date}T12:00:00Z`, "UTC", style);
}
