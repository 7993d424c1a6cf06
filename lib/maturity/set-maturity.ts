// The maturity of each calibration break: from the logger cured with its set when one is attached
// and its record covers the cast to the break, else standard curing with the reason said beside
// the point. Pure: the field (Dexie rows) and the office (PostgreSQL rows) call it alike.
import { maturityBetween, type CalibrationBreak, type MaturitySettings, type TemperatureReading } from "@/lib/concrete";

type Row = Record<string, unknown>;

/** A break of the mix as stored, with its set's cast time and logger (when the loader has them). */
export type MixBreak = {
  ageDays: number;
  strengthMPa: number;
  testedAt?: string | Date | null;
  castAt?: string | Date | null;
  sensorId?: string | null;
};

/** The sensors attached to sets of the mix and their reading batches ([ISO instant, °C] pairs). */
export type SetLoggers = { sensors: Row[]; batches: Row[] };

const MS_PER_HOUR = 3_600_000;
const hoursText = (h: number) => `${h >= 10 ? Math.round(h) : Math.round(h * 10) / 10} h`;
const instant = (v: unknown) => (v instanceof Date ? v : typeof v === "string" ? new Date(v) : null);

function recordsOf(loggers: SetLoggers | undefined): Map<string, { name: string; deleted: boolean; readings: TemperatureReading[] }> {
  const out = new Map<string, { name: string; deleted: boolean; readings: TemperatureReading[] }>();
  for (const s of loggers?.sensors ?? []) out.set(String(s.id), { name: String(s.name), deleted: Boolean(s.deletedAt), readings: [] });
  for (const batch of loggers?.batches ?? []) {
    const record = out.get(String(batch.sensorId));
    if (!record || batch.deletedAt || !Array.isArray(batch.readings)) continue;
    for (const [at, tempC] of batch.readings as [string, number][]) record.readings.push({ at: new Date(at), tempC });
  }
  for (const record of out.values()) record.readings.sort((a, b) => a.at.getTime() - b.at.getTime());
  return out;
}

/** Each break with its logger maturity (from the cast to the break) or, failing that, a note. */
export function calibrationBreaks(breaks: MixBreak[], loggers: SetLoggers | undefined, settings: MaturitySettings): CalibrationBreak[] {
  const records = recordsOf(loggers);
  return breaks.map((b): CalibrationBreak => {
    const plain = { ageDays: b.ageDays, strengthMPa: b.strengthMPa };
    if (!b.sensorId) return plain;
    const record = records.get(b.sensorId);
    const standard = (why: string) => ({ ...plain, note: `${why}; standard curing used for this point.` });
    if (!record || record.deleted) return standard("The logger attached to this set is no longer on the project");
    const castAt = instant(b.castAt);
    const testedAt = instant(b.testedAt);
    if (!castAt || !testedAt || Number.isNaN(castAt.getTime()) || Number.isNaN(testedAt.getTime())) {
      return standard(`The cast or break time is missing for ${record.name}`);
    }
    const breakHours = (testedAt.getTime() - castAt.getTime()) / MS_PER_HOUR;
    const got = maturityBetween(record.readings, castAt, testedAt, settings);
    if (got.status === "starts-after") {
      return standard(
        got.startsAt
          ? `Logger record of ${record.name} starts ${hoursText(got.hoursAfter!)} after the cast`
          : `Logger ${record.name} has no readings`,
      );
    }
    if (got.status === "ends-before") {
      const endsHours = (got.endsAt.getTime() - castAt.getTime()) / MS_PER_HOUR;
      return standard(`Logger record of ${record.name} ends at ${hoursText(endsHours)}, before the break at ${hoursText(breakHours)}`);
    }
    if (got.maturity <= 0) return standard(`Logger record of ${record.name} gained no maturity before the break`);
    return { ...plain, maturity: got.maturity, logger: record.name };
  });
}
