// A truck ticket's clock times, read on the project's wall clock (lib/time/zone). Pure: no React.
// Times are typed in the order they happen; one earlier than the time before it is the next day
// (a night pour batched 23:05 and discharged 00:50), and the form shows each time's date.
import { chainStartDate, chainWallTimes, localDate, localTimeOfDay } from "@/lib/time/zone";

export const TICKET_TIMES = ["batchedAt", "arrivedAt", "dischargeStartedAt", "dischargeFinishedAt"] as const;
export const WATER_TIMES = ["waterFirstAt", "waterLastAt"] as const;
export type TicketTimeName = (typeof TICKET_TIMES)[number] | (typeof WATER_TIMES)[number];
export type TicketClock = Record<TicketTimeName, string>;

export type ResolvedTimes = {
  /** The batch date the chain is read from (YYYY-MM-DD, project-local). */
  date: string;
  at: Record<TicketTimeName, string | null>;
  /** The project-local date of each time entered; a time on a later date than the batch crossed midnight. */
  dates: Partial<Record<TicketTimeName, string>>;
  crossesMidnight: boolean;
};

/**
 * The instants of a ticket's clock times. `date` is the batch date the person chose; without one,
 * today, or yesterday when today would put a time after `now` (logging a night pour after midnight).
 */
export function resolveTicketTimes(clock: TicketClock, timeZone: string, now: Date, date?: string | null): ResolvedTimes {
  const main = TICKET_TIMES.map((k) => clock[k]);
  const start = date || chainStartDate(main, timeZone, now);
  const mainAt = chainWallTimes(start, main, timeZone);
  // Water is added after batching, possibly after midnight too: its own chain from the batch time.
  const waterAt = chainWallTimes(start, [clock.batchedAt, ...WATER_TIMES.map((k) => clock[k])], timeZone).slice(1);
  const at = {} as ResolvedTimes["at"];
  const dates: ResolvedTimes["dates"] = {};
  [...TICKET_TIMES, ...WATER_TIMES].forEach((k, i) => {
    const instant = i < TICKET_TIMES.length ? mainAt[i] : waterAt[i - TICKET_TIMES.length];
    at[k] = instant ? instant.toISOString() : null;
    if (instant) dates[k] = localDate(instant, timeZone);
  });
  const crossesMidnight = Object.values(dates).some((d) => d !== (dates.batchedAt ?? start));
  return { date: start, at, dates, crossesMidnight };
}

/** The clock times of a stored ticket, and its batch date, on the project's wall clock. */
export function clockOf(row: Record<string, unknown>, timeZone: string): { clock: TicketClock; date: string | null } {
  const clock = {} as TicketClock;
  for (const k of [...TICKET_TIMES, ...WATER_TIMES]) {
    const v = row[k];
    const d = typeof v === "string" && v ? new Date(v) : null;
    clock[k] = d && !Number.isNaN(d.getTime()) ? localTimeOfDay(d, timeZone) : "";
  }
  const batched = typeof row.batchedAt === "string" ? new Date(row.batchedAt) : null;
  return { clock, date: batched && !Number.isNaN(batched.getTime()) ? localDate(batched, timeZone) : null };
}

/** Only what changed on an edit, so a field edited elsewhere meanwhile is not overwritten. */
export function changedFields(existing: Record<string, unknown>, values: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(
    Object.entries(values).filter(([key, value]) => {
      const before = existing[key] ?? null;
      const after = value ?? null;
      if (typeof before === "string" && typeof after === "string" && !Number.isNaN(Date.parse(before)) && /T/.test(before)) {
        return Date.parse(before) !== Date.parse(after);
      }
      if (typeof before === "number" && typeof after === "number") return Math.abs(before - after) > 1e-6;
      return before !== after && !(before === "" && after === null);
    }),
  );
}
