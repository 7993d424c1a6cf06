// The hours a digest may go out at (project-local). No imports: client components use it too.
// The digest summarises the day it is sent on, so only afternoon and evening hours make sense.
export const DIGEST_HOURS: readonly number[] = Array.from({ length: 12 }, (_, i) => 12 + i);
export const FIRST_DIGEST_HOUR = 12;
export const LAST_DIGEST_HOUR = 23;

export const hourLabel = (hour: number) => `${String(hour).padStart(2, "0")}:00`;
