"use client";

import { useMemo, useState } from "react";
import type { UnitSystem } from "@/lib/concrete";
import { buildMaturityView } from "@/lib/maturity/view";
import type { MixBreak, SetLoggers } from "@/lib/maturity/set-maturity";
import { MaturitySummary, targetInputOf, targetMPaOf } from "./maturity-summary";

type Row = Record<string, unknown>;

/** The placement's temperature record and estimate for the office: the same model as the field. */
export function OfficeMaturity({
  project,
  placement,
  mixCode,
  records,
}: {
  project: Row & { unitSystem: string; timeZone: string };
  placement: Row & { id: string };
  mixCode: string | null;
  records: { sensors: Row[]; batches: Row[]; breaks: MixBreak[]; loggers?: SetLoggers };
}) {
  const units: UnitSystem = project.unitSystem === "IP" ? "IP" : "SI";
  const [target, setTarget] = useState(() => targetInputOf(project.maturityTargetMPa, units));
  const view = useMemo(
    () => buildMaturityView({ project, placement, mixCode, ...records, targetMPa: targetMPaOf(target, units), now: new Date() }),
    [project, placement, mixCode, records, target, units],
  );
  if (records.sensors.length === 0) return <p className="text-sm text-muted">No temperature sensors on this placement.</p>;
  return (
    <div data-testid="office-maturity">
      <ul className="mb-2 text-sm">
        {view.assessment.sensors.map((s) => (
          <li key={s.id}>
            <strong>{s.name}</strong> · {String(records.sensors.find((r) => r.id === s.id)?.location ?? "")} · {s.series.length} readings
          </li>
        ))}
      </ul>
      <MaturitySummary view={view} units={units} timeZone={project.timeZone} targetText={target} onTargetChange={setTarget} />
    </div>
  );
}
