import { describe, it, expect } from "vitest";

import { guessColumns, parseCsv, readRows, toBatches, type ImportOptions } from "@/lib/maturity/csv-import";
import { sensorReadingsCreateSchema } from "@/lib/records/schemas";

const chicago = (over: Partial<ImportOptions> = {}): ImportOptions => ({
  timeColumn: 0,
  tempColumn: 1,
  unit: "C",
  timeZone: "America/Chicago",
  firstDataLine: 2,
  ...over,
});
const MIN = 60_000;

describe("a 100,000-row logger file", () => {
  it("reads every row, in order, into 100 batches of 1,000 that the sync schema accepts", () => {
    const lines = ["Logger 7731 export", "Date Time,Temperature (°C),Battery"];
    const t0 = Date.UTC(2026, 10, 10, 6, 0); // 00:00 CST on 10 Nov 2026 (UTC−6)
    for (let i = 0; i < 100_000; i += 1) {
      const wall = new Date(t0 - 6 * 3_600_000 + i * MIN).toISOString().slice(0, 16).replace("T", " ");
      lines.push(`${wall},${(14 + 4 * Math.sin(i / 240)).toFixed(2)},3.6`);
    }
    const table = parseCsv(lines.join("\r\n"));
    expect(guessColumns(table.rows)).toEqual({ timeColumn: 0, tempColumn: 1, firstDataLine: 3 });
    const started = performance.now();
    const result = readRows(table, chicago({ firstDataLine: 3 }));
    const ms = performance.now() - started;
    expect(result.bad).toEqual([]);
    expect(result.readings).toHaveLength(100_000);
    // No DST change between 10 Nov 2026 and 19 Feb 2027 in Chicago: the wall clock is UTC−6 throughout [US rules, memory].
    expect(result.readings[0][0].toISOString()).toBe("2026-11-10T06:00:00.000Z");
    expect(result.readings[99_999][0].getTime()).toBe(t0 + 99_999 * MIN);
    const batches = toBatches(result.readings);
    expect(batches).toHaveLength(100);
    expect(sensorReadingsCreateSchema.safeParse({ id: crypto.randomUUID(), sensorId: crypto.randomUUID(), source: "import", readings: batches[99] }).success).toBe(true);
    console.log(`100,000 rows read in ${Math.round(ms)} ms`);
  }, 120_000);
});

describe("bad rows are listed with their line number and reason", () => {
  const csv = [
    "time,temp",
    "2026-11-10 08:00,12.5",
    "2026-11-10 08:15,",
    "2026-11-10 08:30,abc",
    "yesterday,12",
    "2026-11-10 08:45,95",
    "",
    "2026-02-30 09:00,12",
    "2026-11-10 09:00,12.0",
    "2026-11-10 08:50,12.0",
    "11/10/2026 9:15 AM,11.5",
  ].join("\n");

  it("names each line; the good rows are kept, the empty line is skipped", () => {
    const result = readRows(parseCsv(csv), chicago());
    expect(result.bad).toEqual([
      { line: 3, reason: "No temperature" },
      { line: 4, reason: 'Temperature "abc" is not a number' },
      { line: 5, reason: 'Time "yesterday" is not a date and time this import reads (2026-11-02 07:15 or 11/02/2026 7:15 AM)' },
      { line: 6, reason: "95 °C: Temperature must be between -40 and 70 °C" },
      { line: 8, reason: 'Time "2026-02-30 09:00" is not a real date and time' },
      { line: 10, reason: 'Time "2026-11-10 08:50" is not after the reading before it' },
    ]);
    expect(result.skippedEmpty).toBe(1);
    expect(result.readings.map(([at, c]) => [at.toISOString(), c])).toEqual([
      ["2026-11-10T14:00:00.000Z", 12.5],
      ["2026-11-10T15:00:00.000Z", 12],
      ["2026-11-10T15:15:00.000Z", 11.5],
    ]);
  });
});

describe("Fahrenheit and semicolon files", () => {
  it("converts °F to °C: 50 °F → 10 °C, 32 °F → 0 °C, 41 °F → 5 °C [computed by hand: (F − 32) × 5/9]", () => {
    const csv = "t;temp F\n2026-11-10 08:00;50\n2026-11-10 08:15;32\n2026-11-10 08:30;41,0\n2026-11-10 08:45;170";
    const table = parseCsv(csv);
    expect(table.delimiter).toBe(";");
    const result = readRows(table, chicago({ unit: "F" }));
    expect(result.readings.map(([, c]) => c)).toEqual([10, 0, 5]);
    // 170 °F = 76.7 °C, beyond the schema's −40…70 °C: refused with the value as typed.
    expect(result.bad).toEqual([{ line: 5, reason: "170 °F: Temperature must be between -40 and 70 °C" }]);
  });
});

describe("a record across daylight-saving changes (America/Chicago) [US rules, memory: CDT = UTC−5, CST = UTC−6]", () => {
  it("clocks back on Sun 1 Nov 2026: the repeated 01:00–01:59 follows the reading before it", () => {
    const walls = ["00:45", "01:00", "01:15", "01:30", "01:45", "01:00", "01:15", "01:30", "01:45", "02:00"];
    const csv = ["time,temp", ...walls.map((w) => `2026-11-01 ${w},8`)].join("\n");
    const result = readRows(parseCsv(csv), chicago());
    expect(result.bad).toEqual([]);
    // 00:45 CDT = 05:45Z; then every 15 min to 02:00 CST = 08:00Z [computed by hand].
    expect(result.readings.map(([at]) => at.toISOString().slice(11, 16))).toEqual(["05:45", "06:00", "06:15", "06:30", "06:45", "07:00", "07:15", "07:30", "07:45", "08:00"]);
  });

  it("clocks forward on Sun 14 Mar 2027: 01:45 CST → 03:00 CDT is 15 minutes; 02:30 does not exist", () => {
    const csv = "time,temp\n2027-03-14 01:45,6\n2027-03-14 02:30,6\n2027-03-14 03:00,6";
    const result = readRows(parseCsv(csv), chicago());
    expect(result.bad).toEqual([{ line: 3, reason: 'Time "2027-03-14 02:30" does not exist in America/Chicago: the clocks moved forward over it' }]);
    expect(result.readings.map(([at]) => at.toISOString())).toEqual(["2027-03-14T07:45:00.000Z", "2027-03-14T08:00:00.000Z"]);
  });

  it("a time with its own offset is taken as written, whatever zone is chosen", () => {
    const result = readRows(parseCsv("t,c\n2026-11-01T01:30:00-05:00,8\n2026-11-01T01:30:00-06:00,8"), chicago({ timeZone: "Europe/Berlin" }));
    expect(result.readings.map(([at]) => at.toISOString())).toEqual(["2026-11-01T06:30:00.000Z", "2026-11-01T07:30:00.000Z"]);
  });
});
