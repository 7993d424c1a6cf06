"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { FlaskConical, Plus } from "lucide-react";
import { useState } from "react";
import { FindingList } from "@/components/findings/finding-notice";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { formatDensity, formatLength, formatTemperature } from "@/lib/concrete";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { mayWrite, unitSystemOf } from "./field-project";
import { formatTime } from "./project-time";
import { byTime } from "./record-fields";
import { Section } from "./section";
import { deliveryOrder } from "./deliveries";
import { FieldTestForm } from "./field-test-form";
import { VerdictLine, verdictsOf, type Results } from "./field-test-verdicts";
import { findingsFor } from "./findings-model";
import type { FieldFindings } from "./use-findings";

export function FieldTests({ placement, project, mix, checks }: { placement: LocalRecord<"placements">; project: ProjectRow; mix: LocalRecord<"mix-designs"> | null; checks: FieldFindings | undefined }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const deliveries = useLiveQuery(async () => (await listByParent(db, "deliveries", "placementId", placement.id)).sort(deliveryOrder), [db, placement.id]);
  const tests = useLiveQuery(async () => (await listByParent(db, "field-tests", "placementId", placement.id)).sort(byTime("sampledAt")), [db, placement.id]);
  const [adding, setAdding] = useState(false);
  const canWrite = mayWrite(project, "fieldTest.write");

  return (
    <Section
      title="Field tests"
      testId="field-tests"
      actions={
        !adding && canWrite ? (
          <Button data-testid="add-field-test" onClick={() => setAdding(true)}>
            <Plus className="h-5 w-5" aria-hidden="true" /> Add a test
          </Button>
        ) : null
      }
    >
      {adding ? <FieldTestForm placement={placement} project={project} mix={mix} deliveries={deliveries ?? []} checks={checks} onDone={() => setAdding(false)} /> : null}
      {(tests ?? []).length === 0 && !adding ? <p className="text-muted">No tests yet.{canWrite ? "" : " The inspector records them."}</p> : null}
      <ul className="mt-3 flex flex-col gap-3">
        {(tests ?? []).map((t) => {
          const results: Results = { slumpMm: t.slumpMm ?? undefined, airPct: t.airPct ?? undefined, concreteTempC: t.concreteTempC ?? undefined };
          const found = findingsFor(checks?.findings ?? [], "field-test", t.id);
          const verdicts = checks ? verdictsOf(found, results, mix, project, units) : {};
          const truckIndex = (deliveries ?? []).findIndex((d) => d.id === t.deliveryId);
          return (
            <li key={t.id} className="rounded-lg border border-ink-200 p-3" data-testid="field-test-row">
              <p className="flex items-center gap-2 font-bold">
                <FlaskConical className="h-5 w-5 text-ink-600" aria-hidden="true" />
                {truckIndex >= 0 ? `Truck #${truckIndex + 1} (ticket ${(deliveries ?? [])[truckIndex].ticketNumber})` : "Sample"} · {formatTime(t.sampledAt, project.timeZone)}
              </p>
              <dl className="mt-2 grid gap-2 sm:grid-cols-2">
                {results.slumpMm !== undefined ? (
                  <div>
                    <dt className="text-sm text-muted">Slump</dt>
                    <dd className="flex flex-wrap items-center gap-2 text-lg font-semibold">
                      {formatLength(results.slumpMm, units)} <VerdictLine label="Slump" verdict={verdicts.slump} testId="slump-verdict" />
                    </dd>
                  </div>
                ) : null}
                {results.airPct !== undefined ? (
                  <div>
                    <dt className="text-sm text-muted">Air</dt>
                    <dd className="flex flex-wrap items-center gap-2 text-lg font-semibold">
                      {results.airPct.toFixed(1)} % <VerdictLine label="Air" verdict={verdicts.air} testId="air-verdict" />
                    </dd>
                  </div>
                ) : null}
                {results.concreteTempC !== undefined ? (
                  <div>
                    <dt className="text-sm text-muted">Concrete temperature</dt>
                    <dd className="flex flex-wrap items-center gap-2 text-lg font-semibold">
                      {formatTemperature(results.concreteTempC, units)} <VerdictLine label="Temperature" verdict={verdicts.temperature} testId="temp-verdict" />
                    </dd>
                  </div>
                ) : null}
                {typeof t.airTempC === "number" ? (
                  <div>
                    <dt className="text-sm text-muted">Air temperature</dt>
                    <dd className="text-lg font-semibold">{formatTemperature(t.airTempC, units)}</dd>
                  </div>
                ) : null}
                {typeof t.densityKgM3 === "number" ? (
                  <div>
                    <dt className="text-sm text-muted">Density</dt>
                    <dd className="text-lg font-semibold">{formatDensity(t.densityKgM3, units)}</dd>
                  </div>
                ) : null}
              </dl>
              {t.testedBy ? <p className="mt-1 text-sm" data-testid="field-test-tester">Tested by {t.testedBy}</p> : null}
              {t.notes ? <p className="mt-1 text-sm">{t.notes}</p> : null}
              <FindingList findings={found} className="mt-2" testId="field-test-warning" />
              <RecordPhotos projectId={project.id} recordType="field-tests" recordId={t.id} canAdd={canAddPhotos(project, placement)} title="Test photos" />
            </li>
          );
        })}
      </ul>
    </Section>
  );
}

