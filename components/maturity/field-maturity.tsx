"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { Plus } from "lucide-react";
import { useMemo, useState } from "react";
import { mayWrite, unitSystemOf } from "@/components/field/field-project";
import { Section } from "@/components/field/section";
import { Button } from "@/components/ui/button";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import type { SyncDb } from "@/lib/sync/client";
import { buildMaturityView } from "@/lib/maturity/view";
import type { MixBreak } from "@/lib/maturity/set-maturity";
import { MaturitySummary, targetInputOf, targetMPaOf } from "./maturity-summary";
import { SensorForm, SensorRow } from "./sensor-forms";

// Everything the estimate reads, from this device: the sensors and their batches, and the breaks of
// the mix on any placement of the project (the calibration).
async function loadRecords(db: SyncDb, placementId: string, mixId: string | null) {
  const sensors = await listByParent(db, "temperature-sensors", "placementId", placementId);
  const batches = (await Promise.all(sensors.map((s) => listByParent(db, "sensor-readings", "sensorId", s.id)))).flat();
  const breaks: MixBreak[] = [];
  const loggerIds = new Set<string>();
  if (mixId) {
    const placements = (await db.typedRecords("placements").where("mixId").equals(mixId).toArray()).filter((p) => !p.deletedAt);
    for (const p of placements) {
      for (const set of await listByParent(db, "specimen-sets", "placementId", p.id)) {
        const sensorId = typeof set.sensorId === "string" ? set.sensorId : null;
        if (sensorId) loggerIds.add(sensorId);
        for (const b of await listByParent(db, "breaks", "specimenSetId", set.id)) {
          if (typeof b.ageDays === "number" && typeof b.strengthMPa === "number") {
            breaks.push({ ageDays: b.ageDays, strengthMPa: b.strengthMPa, testedAt: b.testedAt as string, castAt: set.castAt as string, sensorId });
          }
        }
      }
    }
  }
  // The loggers cured with the mix's sets (any placement), with every reading: the calibration's maturities.
  const loggerSensors = (await db.typedRecords("temperature-sensors").bulkGet([...loggerIds])).filter((s) => s !== undefined);
  const loggerBatches = (await Promise.all(loggerSensors.map((s) => listByParent(db, "sensor-readings", "sensorId", s.id)))).flat();
  return { sensors, batches, breaks, loggers: { sensors: loggerSensors, batches: loggerBatches } };
}

/** The placement's temperature record and in-place strength estimate, on the phone, offline. */
export function FieldMaturity({ placement, project, mix }: { placement: LocalRecord<"placements">; project: ProjectRow; mix: LocalRecord<"mix-designs"> | null }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const mixId = typeof placement.mixId === "string" ? placement.mixId : null;
  const records = useLiveQuery(() => loadRecords(db, placement.id, mixId), [db, placement.id, mixId]);
  const [target, setTarget] = useState(() => targetInputOf(project.maturityTargetMPa, units));
  const [adding, setAdding] = useState(false);
  const canWrite = mayWrite(project, "curing.write");
  const view = useMemo(
    () =>
      records
        ? buildMaturityView({ project, placement, mixCode: mix ? String(mix.code) : null, ...records, targetMPa: targetMPaOf(target, units), now: new Date() })
        : null,
    [records, project, placement, mix, target, units],
  );
  return (
    <Section
      title="Temperature & maturity"
      testId="maturity-panel"
      actions={
        canWrite && !adding ? (
          <Button data-testid="add-sensor" onClick={() => setAdding(true)}>
            <Plus className="h-5 w-5" aria-hidden="true" /> Add a sensor
          </Button>
        ) : null
      }
    >
      {adding ? <SensorForm placement={placement} onDone={() => setAdding(false)} /> : null}
      <ul className="mb-3 flex flex-col gap-2">
        {(records?.sensors ?? []).map((s) => (
          <SensorRow key={s.id} sensor={s} project={project} canWrite={canWrite} readings={view?.assessment.sensors.find((a) => a.id === s.id)?.series.length ?? 0} />
        ))}
      </ul>
      {view ? <MaturitySummary view={view} units={units} timeZone={project.timeZone} targetText={target} onTargetChange={setTarget} /> : null}
    </Section>
  );
}
