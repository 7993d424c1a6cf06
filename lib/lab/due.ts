// When a cylinder is due for its test, and the age of a break from its cast and test times. Pure:
// used by the lab queue on the server and by the break form in the browser.

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

// ASTM C39 permissible tolerance on the test age [memory: C39 table]: 24 h ± 0.5 h, 3 d ± 2 h,
// 7 d ± 6 h, 28 d ± 20 h, 90 d ± 2 d. Ages between the listed ones take the next listed tolerance.
const TOLERANCE_HOURS: [number, number][] = [
  [1, 0.5],
  [3, 2],
  [7, 6],
  [28, 20],
  [90, 48],
];

/** The permitted tolerance on a test age, in hours (ASTM C39). */
export function testAgeToleranceHours(ageDays: number): number {
  for (const [age, hours] of TOLERANCE_HOURS) if (ageDays <= age) return hours;
  return 48;
}

/** The moment a test age is reached: cast time + age. */
export function dueAt(castAt: Date, ageDays: number): Date {
  return new Date(castAt.getTime() + ageDays * DAY_MS);
}

/** The window in which a test still counts as at that age (ASTM C39 tolerance). */
export function testWindow(castAt: Date, ageDays: number): { opensAt: Date; closesAt: Date } {
  const due = dueAt(castAt, ageDays).getTime();
  const tolerance = testAgeToleranceHours(ageDays) * HOUR_MS;
  return { opensAt: new Date(due - tolerance), closesAt: new Date(due + tolerance) };
}

export type DueStatus = "due" | "overdue" | "tested";

/** Tested once a cylinder was broken at that age; overdue once the C39 window closed without one. */
export function dueStatus(castAt: Date, ageDays: number, brokenCount: number, now: Date): DueStatus {
  if (brokenCount > 0) return "tested";
  return now.getTime() > testWindow(castAt, ageDays).closesAt.getTime() ? "overdue" : "due";
}

/**
 * The age of a break in whole days: the planned test age whose C39 window holds the test time
 * (a 28-day test broken at 27 d 6 h is the 28-day test), else the elapsed time rounded to days.
 * Null when the test time is before the cast time.
 */
export function breakAgeDays(castAt: Date, testedAt: Date, plannedAgesDays: readonly number[] = []): number | null {
  const elapsed = testedAt.getTime() - castAt.getTime();
  if (!Number.isFinite(elapsed) || elapsed < 0) return null;
  for (const age of plannedAgesDays) {
    const { opensAt, closesAt } = testWindow(castAt, age);
    if (testedAt >= opensAt && testedAt <= closesAt) return age;
  }
  return Math.round(elapsed / DAY_MS);
}
