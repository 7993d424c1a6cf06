// One placement's maturity picture, computed once for every surface (field screen, office review,
// rulebook): the series per sensor, the estimate now at the coldest sensor, and when a target is reached.
import { maturityForStrength, estimateWithinCalibration, type Calibration, type StrengthEstimate } from "./maturity-calibration";
import { maturitySeries, type MaturitySettings, type TemperatureReading } from "./maturity";
import { timeToMaturity, type SeriesPoint, type TargetTime } from "./maturity-record";

export type SensorRecord = { id: string; name: string; readings: TemperatureReading[] };

export type SensorAssessment = {
  id: string;
  name: string;
  series: SeriesPoint[];
  /** Maturity at the last reading (null under two readings). */
  maturity: number | null;
  estimate: StrengthEstimate | null;
  target: TargetTime | null;
};

export type TargetAssessment =
  | (TargetTime & { sensorId: string })
  | { status: "refused"; reason: string }
  | { status: "no-target" };

export type MaturityAssessment = {
  sensors: SensorAssessment[];
  /** The sensor with the least maturity: the estimate is read there (ASTM C1074: the critical location). */
  coldest: SensorAssessment | null;
  estimate: StrengthEstimate | null;
  target: TargetAssessment;
  /** Why there is no estimate at all (no calibration, too few readings). */
  reason: string | null;
};

// A declaration, not an arrow constant: its mutants are switched per call, which StrykerJS can test.
function byTime(a: TemperatureReading, b: TemperatureReading): number {
  return a.at.getTime() - b.at.getTime();
}

export function assessPlacementMaturity({
  sensors,
  settings,
  calibration,
  targetMPa,
}: {
  sensors: SensorRecord[];
  settings: MaturitySettings;
  calibration: Calibration | null;
  targetMPa: number | null;
}): MaturityAssessment {
  const fit = calibration?.ok ? calibration.fit : null;
  const target = fit && targetMPa !== null ? maturityForStrength(fit, targetMPa) : null;
  const assessed = sensors.map((sensor): SensorAssessment => {
    const readings = [...sensor.readings].sort(byTime);
    if (readings.length < 2) return { id: sensor.id, name: sensor.name, series: [], maturity: null, estimate: null, target: null };
    const series = maturitySeries(readings, settings);
    const maturity = series[series.length - 1].maturity;
    return {
      id: sensor.id,
      name: sensor.name,
      series,
      maturity,
      estimate: fit ? estimateWithinCalibration(fit, maturity) : null,
      target: target?.ok ? timeToMaturity(series, target.maturity, settings) : null,
    };
  });
  const withData = assessed.filter((s) => s.maturity !== null);
  const coldest = withData.reduce<SensorAssessment | null>((low, s) => (low === null || s.maturity! < low.maturity! ? s : low), null);
  let reason: string | null = null;
  if (calibration === null) reason = "The placement's mix has no calibration, so there is no strength estimate.";
  else if (!calibration.ok) reason = calibration.reason;
  else if (coldest === null) reason = "A sensor needs at least two readings before there is an estimate.";
  return { sensors: assessed, coldest, estimate: coldest?.estimate ?? null, target: targetOf(withData, target), reason };
}

// The placement reaches the target when its last sensor does; a sensor that is not gaining holds it back.
function targetOf(sensors: SensorAssessment[], target: ReturnType<typeof maturityForStrength> | null): TargetAssessment {
  if (target === null) return { status: "no-target" };
  if (!target.ok) return { status: "refused", reason: target.reason };
  let latest: TargetAssessment = { status: "no-target" };
  for (const s of sensors) {
    const t = s.target!;
    if (t.status === "not-gaining") return { ...t, sensorId: s.id };
    if (latest.status === "no-target" || (("at" in latest) && t.at.getTime() > latest.at.getTime())) latest = { ...t, sensorId: s.id };
  }
  return latest;
}
