// The demo's maturity record (invented): the Level 2 deck at Larkspur Commons with two loggers over
// four days, and a calibration set of its mix (LC-5000-D) broken at 1, 2, 3 and 7 days by Fenwick
// Hollow Materials Lab. Night two has a 3-hour hole in the edge logger's record (battery swap).
import { inToMm, psiToMPa } from "@/lib/concrete/units";
import type { RecordType } from "@/lib/records/registry";
import { chicago, demoId, type DemoRecord } from "./ids";

type Ids = { project: string; deck: string; delivery: string; sam: string; ines: string; olu: string };

const HOUR = 3_600_000;
const areaMm2 = (d: number) => (Math.PI * d * d) / 4;

// A deck's core warms with hydration for about a day, then follows the air; the edge follows the air more.
function temperatureC(hours: number, where: "core" | "edge"): number {
  const hydration = (where === "core" ? 17 : 10) * Math.exp(-(((hours - 14) / 10) ** 2));
  const daily = (where === "core" ? 2 : 5) * Math.sin((2 * Math.PI * (hours - 6)) / 24);
  const base = where === "core" ? 22 : 21.5;
  return Math.round((base + hydration + daily) * 10) / 10;
}

export function maturityDemoRecords(ids: Ids): [RecordType, DemoRecord[]][] {
  const cast = chicago("2026-11-17", "14:20");
  const set: DemoRecord = {
    projectId: ids.project, by: ids.ines, recordedAt: cast,
    values: {
      id: demoId(0x531), placementId: ids.deck, deliveryId: ids.delivery, setCode: "LC-D2-CAL", castAt: cast, count: 8, testAgesDays: [1, 2, 3, 7],
      cylinderDiameterMm: 100, cylinderLengthMm: inToMm(8), initialCuringMinC: 21, initialCuringMaxC: 25,
    },
  };
  let n = 0x640;
  const breakOf = (ageDays: number, psi: number): DemoRecord => {
    const testedAt = new Date(cast.getTime() + ageDays * 24 * HOUR);
    return {
      projectId: ids.project, by: ids.olu, recordedAt: testedAt,
      values: { id: demoId(++n), specimenSetId: set.values.id, testedAt, ageDays, loadKN: Math.round(psiToMPa(psi) * areaMm2(inToMm(4))) / 1000, diameterMm: inToMm(4), lengthMm: inToMm(8), fractureType: 2 },
    };
  };
  const breaks = [breakOf(1, 1480), breakOf(1, 1420), breakOf(2, 2230), breakOf(2, 2170), breakOf(3, 2660), breakOf(3, 2610), breakOf(7, 3620), breakOf(7, 3590)];

  const start = chicago("2026-11-17", "15:00");
  const end = new Date(start.getTime() + 96 * HOUR);
  const sensor = (id: string, name: string, location: string): DemoRecord => ({
    projectId: ids.project, by: ids.sam, recordedAt: start,
    values: { id, placementId: ids.deck, name, location, loggingIntervalMinutes: 30, endedAt: end, note: null },
  });
  const core = sensor(demoId(0xb01), "T1", "Grid F/3, mid-depth, thickest bay");
  const edge = sensor(demoId(0xb02), "T2", "North edge at grid A/2, 1 in below the top");
  const record = (sensorId: string, where: "core" | "edge", batchId: string): DemoRecord => {
    const readings: [string, number][] = [];
    for (let half = 0; half <= 96 * 2; half += 1) {
      const hours = half / 2;
      if (where === "edge" && hours > 34 && hours < 37) continue; // battery swap on night two
      readings.push([new Date(start.getTime() + hours * HOUR).toISOString(), temperatureC(hours + 0.67, where)]);
    }
    return { projectId: ids.project, by: ids.sam, recordedAt: end, values: { id: batchId, sensorId, source: "import", readings } };
  };
  return [
    ["specimen-sets", [set]],
    ["breaks", breaks],
    ["temperature-sensors", [core, edge]],
    ["sensor-readings", [record(core.values.id as string, "core", demoId(0xb11)), record(edge.values.id as string, "edge", demoId(0xb12))]],
  ];
}
