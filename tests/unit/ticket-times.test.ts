// A truck ticket's clock times on the project's wall clock (lib/time/zone, components/field/delivery-times).
// Offsets of America/Chicago from the IANA time-zone database [published: tz database, US rules since
// 2007]: CST is UTC−6, CDT is UTC−5; clocks go forward at 02:00 on the second Sunday of March
// (2026-03-08) and back at 02:00 on the first Sunday of November (2026-11-01).
import { describe, expect, it } from "vitest";
import { resolveTicketTimes } from "@/components/field/delivery-times";
import { chainStartDate, chainWallTimes, localDateTimeToInstant, wallTimeInstants } from "@/lib/time/zone";

const ZONE = "America/Chicago";
const iso = (d: Date | null) => d?.toISOString() ?? null;
const clock = (batchedAt: string, arrivedAt: string, dischargeStartedAt = "", dischargeFinishedAt = "") => ({
  batchedAt, arrivedAt, dischargeStartedAt, dischargeFinishedAt, waterFirstAt: "", waterLastAt: "",
});

describe("a ticket's times across midnight", () => {
  it("23:05 → 23:40 → 00:10 → 00:50: the last two are the next day (July, CDT = UTC−5)", () => {
    const at = chainWallTimes("2026-07-14", ["23:05", "23:40", "00:10", "00:50"], ZONE).map(iso);
    expect(at).toEqual(["2026-07-15T04:05:00.000Z", "2026-07-15T04:40:00.000Z", "2026-07-15T05:10:00.000Z", "2026-07-15T05:50:00.000Z"]);
  });

  it("logged at 00:50 without a batch date: the batch is read on the day before, and the form says the truck crossed midnight", () => {
    const now = new Date("2026-07-15T05:50:00Z"); // 00:50 CDT on Jul 15
    expect(chainStartDate(["23:05", "23:40", "00:10", "00:50"], ZONE, now)).toBe("2026-07-14");
    const r = resolveTicketTimes(clock("23:05", "23:40", "00:10", "00:50"), ZONE, now);
    expect(r.date).toBe("2026-07-14");
    expect(r.dates).toEqual({ batchedAt: "2026-07-14", arrivedAt: "2026-07-14", dischargeStartedAt: "2026-07-15", dischargeFinishedAt: "2026-07-15" });
    expect(r.crossesMidnight).toBe(true);
    // A day pour typed the same day keeps today's date and does not say it crossed midnight.
    const day = resolveTicketTimes(clock("09:40", "10:08", "10:14", "10:40"), ZONE, new Date("2026-07-15T17:00:00Z"));
    expect(day.date).toBe("2026-07-15");
    expect(day.crossesMidnight).toBe(false);
  });

  it("blank times do not move the chain", () => {
    expect(chainWallTimes("2026-07-14", ["23:05", "", null, "00:50"], ZONE).map(iso)).toEqual(["2026-07-15T04:05:00.000Z", null, null, "2026-07-15T05:50:00.000Z"]);
  });
});

describe("the daylight-saving change days in America/Chicago", () => {
  it("2026-03-08: 02:30 does not exist; it is read as 03:30 CDT (UTC−5); 01:30 CST → 03:10 CDT is 40 min", () => {
    expect(wallTimeInstants("2026-03-08", "02:30", ZONE).map(iso)).toEqual(["2026-03-08T08:30:00.000Z"]);
    const [batched, finished] = chainWallTimes("2026-03-08", ["01:30", "03:10"], ZONE);
    expect(batched!.toISOString()).toBe("2026-03-08T07:30:00.000Z");
    expect((finished!.getTime() - batched!.getTime()) / 60_000).toBe(40);
  });

  it("2026-11-01: 01:30 happens twice; after 01:50 CDT, 01:10 is 01:10 CST the same night (20 min later), not the next day", () => {
    expect(wallTimeInstants("2026-11-01", "01:30", ZONE).map(iso)).toEqual(["2026-11-01T06:30:00.000Z", "2026-11-01T07:30:00.000Z"]);
    const at = chainWallTimes("2026-11-01", ["01:20", "01:50", "01:10", "01:40"], ZONE).map(iso);
    expect(at).toEqual(["2026-11-01T06:20:00.000Z", "2026-11-01T06:50:00.000Z", "2026-11-01T07:10:00.000Z", "2026-11-01T07:40:00.000Z"]);
    // A datetime-local value in the repeated hour is its first occurrence (CDT).
    expect(iso(localDateTimeToInstant("2026-11-01T01:30", ZONE))).toBe("2026-11-01T06:30:00.000Z");
  });
});
