// A logger's CSV export turned into readings: the person picks the time and temperature columns, the
// unit and the time zone; every row that cannot be used is listed with its line number and reason.
// Pure (papaparse runs in the browser's worker and in Node tests alike); nothing is stored here.
import Papa from "papaparse";
import { fToC } from "@/lib/concrete/units";
import { wallClockInstants } from "@/lib/time/zone";
import { MAX_READINGS_PER_BATCH } from "@/lib/records/enums";
import { temperatureC } from "@/lib/records/schemas/fields";

export type CsvTable = { rows: string[][]; delimiter: string };
export type ImportOptions = {
  timeColumn: number;
  tempColumn: number;
  unit: "C" | "F";
  /** The zone of times written without an offset (most loggers write local time). */
  timeZone: string;
  /** Line numbers (1-based) before this are headings and skipped. */
  firstDataLine: number;
};
export type BadRow = { line: number; reason: string };
export type ImportResult = { readings: [Date, number][]; bad: BadRow[]; skippedEmpty: number };

export function parseCsv(text: string): CsvTable {
  const out = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { skipEmptyLines: false });
  return { rows: out.data, delimiter: out.meta.delimiter };
}

/** The first line whose time and temperature cells look like data: where the headings end. */
export function guessColumns(rows: string[][]): { timeColumn: number; tempColumn: number; firstDataLine: number } {
  for (let i = 0; i < Math.min(rows.length, 50); i += 1) {
    const cells = rows[i];
    const timeColumn = cells.findIndex((c) => DATE_SHAPES.some((re) => re.test(c.trim())));
    const tempColumn = cells.findIndex((c, j) => j !== timeColumn && NUMBER.test(c.trim()));
    if (timeColumn >= 0 && tempColumn >= 0) return { timeColumn, tempColumn, firstDataLine: i + 1 };
  }
  return { timeColumn: 0, tempColumn: Math.min(1, (rows[0]?.length ?? 1) - 1), firstDataLine: 2 };
}

const NUMBER = /^[-+]?\d+(?:[.,]\d+)?$/;
// ISO-like (2026-11-02 07:15[:00][.000][Z|±hh:mm]) and US month/day/year with an optional AM/PM.
const ISO = /^(\d{4})-(\d{1,2})-(\d{1,2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const US = /^(\d{1,2})\/(\d{1,2})\/(\d{4})[ ,]+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*(AM|PM)?$/i;
const DATE_SHAPES = [ISO, US];

type Parsed = { ok: true; candidates: number[] } | { ok: false; reason: string };

function wallTime(text: string): { wall: Parameters<typeof wallClockInstants>[0]; offset: string | null } | null {
  const iso = ISO.exec(text);
  if (iso) {
    const [, y, mo, d, h, mi, s, off] = iso;
    return { wall: { year: +y, month: +mo, day: +d, hour: +h, minute: +mi, second: +(s ?? 0) }, offset: off ?? null };
  }
  const us = US.exec(text);
  if (us) {
    const [, mo, d, y, h, mi, s, ampm] = us;
    let hour = +h;
    if (ampm) {
      if (hour < 1 || hour > 12) return null;
      hour = (hour % 12) + (ampm.toUpperCase() === "PM" ? 12 : 0);
    }
    return { wall: { year: +y, month: +mo, day: +d, hour, minute: +mi, second: +(s ?? 0) }, offset: null };
  }
  return null;
}

// Intl's zone lookups are slow (100,000 rows took seconds): an hour with one steady offset is looked
// up once; an hour in which the clocks change is worked out row by row.
type HourCache = Map<string, number | null>;
function instantsOf(wall: Parameters<typeof wallClockInstants>[0], timeZone: string, cache?: HourCache): number[] {
  const key = `${wall.year}-${wall.month}-${wall.day}T${wall.hour}`;
  const wallMs = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
  let offset = cache?.get(key);
  if (cache && offset === undefined) {
    const start = wallClockInstants({ ...wall, minute: 0, second: 0 }, timeZone).instants;
    const end = wallClockInstants({ ...wall, minute: 59, second: 59 }, timeZone).instants;
    const startWall = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour);
    const steady = start.length === 1 && end.length === 1 && end[0] - start[0] === 3_599_000;
    offset = steady ? startWall - start[0] : null;
    cache.set(key, offset);
  }
  if (typeof offset === "number") return [wallMs - offset];
  return wallClockInstants(wall, timeZone).instants;
}

/** The instants a time cell may mean (two in the repeated hour when clocks go back). */
export function parseTime(text: string, timeZone: string, cache?: HourCache): Parsed {
  const cell = text.trim();
  if (!cell) return { ok: false, reason: "No time" };
  const parsed = wallTime(cell);
  if (!parsed) return { ok: false, reason: `Time "${cell}" is not a date and time this import reads (2026-11-02 07:15 or 11/02/2026 7:15 AM)` };
  const { wall, offset } = parsed;
  const check = new Date(Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second));
  if (check.getUTCMonth() !== wall.month - 1 || check.getUTCDate() !== wall.day || check.getUTCHours() !== wall.hour || wall.minute > 59 || wall.second > 59) {
    return { ok: false, reason: `Time "${cell}" is not a real date and time` };
  }
  if (offset) {
    const sign = offset.toUpperCase() === "Z" ? 0 : offset.startsWith("-") ? -1 : 1;
    const digits = offset.replace(/[^0-9]/g, "");
    const offsetMs = sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4) || 0)) * 60_000;
    return { ok: true, candidates: [check.getTime() - offsetMs] };
  }
  const instants = instantsOf(wall, timeZone, cache);
  if (instants.length === 0) return { ok: false, reason: `Time "${cell}" does not exist in ${timeZone}: the clocks moved forward over it` };
  return { ok: true, candidates: instants };
}

const tempSchema = temperatureC("Temperature");

/** Every data row checked; readings come out in the file's order, which must be time order. */
export function readRows(table: CsvTable, options: ImportOptions): ImportResult {
  const readings: [Date, number][] = [];
  const bad: BadRow[] = [];
  let skippedEmpty = 0;
  let previous = -Infinity;
  const cache: HourCache = new Map();
  for (let i = options.firstDataLine - 1; i < table.rows.length; i += 1) {
    const line = i + 1;
    const cells = table.rows[i];
    if (cells.every((c) => c.trim() === "")) {
      skippedEmpty += 1;
      continue;
    }
    const time = parseTime(cells[options.timeColumn] ?? "", options.timeZone, cache);
    if (!time.ok) {
      bad.push({ line, reason: time.reason });
      continue;
    }
    const raw = (cells[options.tempColumn] ?? "").trim();
    if (!NUMBER.test(raw)) {
      bad.push({ line, reason: raw ? `Temperature "${raw}" is not a number` : "No temperature" });
      continue;
    }
    const value = Number(raw.replace(",", "."));
    const tempC = options.unit === "F" ? fToC(value) : value;
    const checked = tempSchema.safeParse(tempC);
    if (!checked.success) {
      bad.push({ line, reason: `${raw} °${options.unit}: ${checked.error.issues[0].message}` });
      continue;
    }
    // In the repeated hour after clocks go back, the reading that follows the previous one is meant.
    const at = time.candidates.find((t) => t > previous);
    if (at === undefined) {
      bad.push({ line, reason: `Time "${cells[options.timeColumn].trim()}" is not after the reading before it` });
      continue;
    }
    previous = at;
    readings.push([new Date(at), tempC]);
  }
  return { readings, bad, skippedEmpty };
}

/** Readings split into the batches that are stored and synced (records of type sensor-readings). */
export function toBatches(readings: [Date, number][], size: number = MAX_READINGS_PER_BATCH): [string, number][][] {
  const batches: [string, number][][] = [];
  for (let i = 0; i < readings.length; i += size) {
    batches.push(readings.slice(i, i + size).map(([at, tempC]) => [at.toISOString(), Math.round(tempC * 1000) / 1000]));
  }
  return batches;
}
