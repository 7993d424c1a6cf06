// Due dates read as dates, not ISO strings (issue 17 item 9). 17 November 2026 is a Tuesday and
// 1 March 2026 a Sunday [any calendar]; a calendar date has no zone, so it never shifts a day.
import { describe, expect, it } from "vitest";
import { calendarDateText } from "@/lib/time/zone";

describe("calendarDateText", () => {
  it("words a due date with its weekday", () => {
    expect(calendarDateText("2026-11-17")).toBe("Tue, Nov 17, 2026");
    expect(calendarDateText("2026-03-01")).toBe("Sun, Mar 1, 2026");
  });
  it("leaves anything that is not a date as it was", () => {
    expect(calendarDateText("soon")).toBe("soon");
  });
});
