// The digest's send time: a wall-clock hour in the project's zone, across daylight-saving changes.
// US rule (Energy Policy Act of 2005): clocks go forward at 02:00 on the second Sunday of March
// (2026-03-08) and back at 02:00 on the first Sunday of November (2026-11-01).
import { describe, expect, it } from "vitest";
import { digestDateFor, nextSendTime } from "@/lib/digest/schedule";
import { addDays, localDate, localDayRange, zonedTimeToInstant } from "@/lib/time/zone";

const CHICAGO = "America/Chicago";
const at = (iso: string) => new Date(iso);

describe("nextSendTime in America/Chicago at 18:00", () => {
  it("uses CDT (UTC−5) the evening before clocks go back", () => {
    expect(nextSendTime(at("2026-10-31T12:00:00Z"), CHICAGO, 18).toISOString()).toBe("2026-10-31T23:00:00.000Z");
  });

  it("uses CST (UTC−6) on the fall-back day itself, 2026-11-01", () => {
    // Asked after Saturday's digest went out (20:00 CDT = 01:00Z Sunday).
    const next = nextSendTime(at("2026-11-01T01:00:00Z"), CHICAGO, 18);
    expect(next.toISOString()).toBe("2026-11-02T00:00:00.000Z");
    expect(digestDateFor(next, CHICAGO)).toBe("2026-11-01");
  });

  it("is 25 hours after the previous send across the fall-back night", () => {
    const saturday = nextSendTime(at("2026-10-31T12:00:00Z"), CHICAGO, 18);
    const sunday = nextSendTime(saturday, CHICAGO, 18);
    expect((sunday.getTime() - saturday.getTime()) / 3_600_000).toBe(25);
  });

  it("uses CST the evening before clocks go forward and CDT on 2026-03-08", () => {
    const saturday = nextSendTime(at("2026-03-07T15:00:00Z"), CHICAGO, 18);
    expect(saturday.toISOString()).toBe("2026-03-08T00:00:00.000Z");
    expect(digestDateFor(saturday, CHICAGO)).toBe("2026-03-07");
    const sunday = nextSendTime(saturday, CHICAGO, 18);
    expect(sunday.toISOString()).toBe("2026-03-08T23:00:00.000Z");
    expect(digestDateFor(sunday, CHICAGO)).toBe("2026-03-08");
    expect((sunday.getTime() - saturday.getTime()) / 3_600_000).toBe(23);
  });

  it("is strictly after now: at the send instant itself the next one is the following day", () => {
    const sendAt = at("2026-11-17T00:00:00Z"); // 18:00 CST on 2026-11-16
    expect(nextSendTime(sendAt, CHICAGO, 18).toISOString()).toBe("2026-11-18T00:00:00.000Z");
    expect(nextSendTime(new Date(sendAt.getTime() - 1), CHICAGO, 18).toISOString()).toBe(sendAt.toISOString());
  });
});

describe("hours that are skipped or repeated", () => {
  it("takes the first 01:00 when clocks go back (01:00 CDT, not 01:00 CST)", () => {
    expect(zonedTimeToInstant("2026-11-01", 1, CHICAGO).toISOString()).toBe("2026-11-01T06:00:00.000Z");
  });

  it("moves the skipped 02:00 of 2026-03-08 to 03:00 CDT", () => {
    expect(zonedTimeToInstant("2026-03-08", 2, CHICAGO).toISOString()).toBe("2026-03-08T08:00:00.000Z");
  });

  it("gives a 23-hour and a 25-hour local day on the change days", () => {
    const spring = localDayRange("2026-03-08", CHICAGO);
    const fall = localDayRange("2026-11-01", CHICAGO);
    expect((spring.end.getTime() - spring.start.getTime()) / 3_600_000).toBe(23);
    expect((fall.end.getTime() - fall.start.getTime()) / 3_600_000).toBe(25);
  });
});

describe("zones without daylight saving", () => {
  it("keeps the same UTC instant all year in America/Phoenix (UTC−7)", () => {
    for (const [now, expected] of [
      ["2026-03-07T12:00:00Z", "2026-03-08T01:00:00.000Z"],
      ["2026-03-08T12:00:00Z", "2026-03-09T01:00:00.000Z"],
      ["2026-11-01T12:00:00Z", "2026-11-02T01:00:00.000Z"],
    ]) {
      expect(nextSendTime(at(now), "America/Phoenix", 18).toISOString()).toBe(expected);
    }
  });

  it("handles a zone ahead of UTC whose evening is the UTC morning (Asia/Kolkata, UTC+5:30)", () => {
    const next = nextSendTime(at("2026-11-17T10:00:00Z"), "Asia/Kolkata", 18);
    expect(next.toISOString()).toBe("2026-11-17T12:30:00.000Z");
    expect(digestDateFor(next, "Asia/Kolkata")).toBe("2026-11-17");
  });

  it("works in UTC", () => {
    expect(nextSendTime(at("2026-12-31T18:00:00Z"), "UTC", 18).toISOString()).toBe("2027-01-01T18:00:00.000Z");
  });
});

describe("calendar helpers", () => {
  it("adds days across month and year ends", () => {
    expect(addDays("2026-12-31", 1)).toBe("2027-01-01");
    expect(addDays("2026-03-01", -1)).toBe("2026-02-28");
  });

  it("reads the local date of an instant", () => {
    expect(localDate(at("2026-11-18T03:00:00Z"), CHICAGO)).toBe("2026-11-17");
  });

  it("refuses an impossible date or hour", () => {
    expect(() => zonedTimeToInstant("2026-02-30", 18, CHICAGO)).toThrow(RangeError);
    expect(() => zonedTimeToInstant("2026-02-03", 24, CHICAGO)).toThrow(RangeError);
  });
});
