// When a project's digest goes out, in the project's local time (lib/time/zone).
import { addDays, localDate, zonedTimeToInstant } from "@/lib/time/zone";

/** First instant strictly after `now` at which the project-local clock shows `hour`:00. */
export function nextSendTime(now: Date, timeZone: string, hour: number): Date {
  const today = localDate(now, timeZone);
  const candidate = zonedTimeToInstant(today, hour, timeZone);
  if (candidate.getTime() > now.getTime()) return candidate;
  return zonedTimeToInstant(addDays(today, 1), hour, timeZone);
}

/** The project-local date a digest sent at `sendTime` summarises: the day it is sent on. */
export function digestDateFor(sendTime: Date, timeZone: string): string {
  return localDate(sendTime, timeZone);
}

