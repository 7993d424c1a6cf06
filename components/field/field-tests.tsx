"use client";

import { FormFooter } from "./form-footer";
import { useLiveQuery } from "dexie-react-hooks";
import { FlaskConical, Plus } from "lucide-react";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FindingList } from "@/components/findings/finding-notice";
import { toCheckMix, toCheckProject, type Finding } from "@/lib/checks";
import { airRangeFor, maxTemperatureFor, slumpRangeFor } from "@/lib/checks/field-tests";
import { concreteYield, formatDensity, formatLength, formatTemperature, formatVolume, type UnitSystem } from "@/lib/concrete";
import { createLocal, listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { deliveryOrder } from "./deliveries";
import { Section, Verdict, mayWrite, byTime, formatTime, num, parseNumber, str, toSI, unitLabel, unitSystemOf, writeErrorOf } from "./common";
import { draftFindings, findingsFor } from "./findings-model";
import type { FieldFindings } from "./use-findings";

type Results = { slumpMm?: number; airPct?: number; concreteTempC?: number };
type Verdicts = { slump?: { ok: boolean; range: string }; air?: { ok: boolean; range: string }; temperature?: { ok: boolean; range: string } };

/**
 * Each measured value beside the range it was judged against; the verdict is the rulebook's (a finding
 * of that rule on this test means out of range). The ranges are the rulebook's too: the mix's own
 * tolerance, else ASTM C94's, and the maximum temperature of the mix, else the project.
 */
export function verdictsOf(found: Finding[], results: Results, mix: LocalRecord | null, project: ProjectRow, units: UnitSystem): Verdicts {
  const out: Verdicts = {};
  const m = mix ? toCheckMix(mix) : null;
  const has = (rule: Finding["rule"]) => found.some((f) => f.rule === rule);
  const slump = m && slumpRangeFor(m, units);
  if (results.slumpMm !== undefined && slump) out.slump = { ok: !has("slump"), range: `${slump.min > 0 ? `${formatLength(slump.min, units)} to ` : "up to "}${formatLength(slump.max, units)}` };
  const air = m && airRangeFor(m);
  if (results.airPct !== undefined && air) out.air = { ok: !has("air-content"), range: `${air.min.toFixed(1)} to ${air.max.toFixed(1)} %` };
  if (results.concreteTempC !== undefined) {
    const { max } = maxTemperatureFor(m, toCheckProject(project));
    out.temperature = { ok: !has("concrete-temperature"), range: `at most ${max} ${unitLabel("temperature", units)}` };
  }
  return out;
}

// The concrete temperature has only a maximum, so its words say so rather than "out of tolerance".
const WORDS: Record<string, { ok: string; bad: string }> = { Temperature: { ok: "Temperature within the maximum", bad: "Above the maximum temperature" } };

function VerdictLine({ label, verdict, testId }: { label: string; verdict?: { ok: boolean; range: string }; testId: string }) {
  if (!verdict) return null;
  return (
    <span className="flex flex-wrap items-center gap-1 text-sm">
      <Verdict ok={verdict.ok} testId={testId} okText={WORDS[label]?.ok ?? `${label} in tolerance`} badText={WORDS[label]?.bad ?? `${label} out of tolerance`} />
      <span className="text-muted">({verdict.range})</span>
    </span>
  );
}

type Values = { deliveryId: string; slump: string; air: string; concreteTemp: string; airTemp: string; density: string; batchMass: string; notes: string };

function FieldTestForm({
  placement,
  project,
  mix,
  deliveries,
  checks,
  onDone,
}: {
  placement: LocalRecord;
  project: ProjectRow;
  mix: LocalRecord | null;
  deliveries: LocalRecord[];
  checks: FieldFindings | undefined;
  onDone: () => void;
}) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, formState } = useForm<Values>({
    defaultValues: { deliveryId: deliveries[deliveries.length - 1]?.id ?? "", slump: "", air: "", concreteTemp: "", airTemp: "", density: "", batchMass: "", notes: "" },
  });
  useDirtyGuard("field-test-new", formState.isDirty);
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const results: Results = {
    slumpMm: toSI("length", v.slump, units) ?? undefined,
    airPct: parseNumber(v.air) ?? undefined,
    concreteTempC: toSI("temperature", v.concreteTemp, units) ?? undefined,
  };
  const clean = (r: Results): Results => Object.fromEntries(Object.entries(r).filter(([, x]) => typeof x === "number" && Number.isFinite(x)));
  const measured = clean(results);
  const draft = { placementId: placement.id, deliveryId: v.deliveryId || null, sampledAt: new Date().toISOString(), slumpMm: measured.slumpMm ?? null, airPct: measured.airPct ?? null, concreteTempC: measured.concreteTempC ?? null };
  const live = checks ? draftFindings(checks.records, "fieldTests", draft, new Date()) : [];
  const verdicts = checks ? verdictsOf(live, measured, mix, project, units) : {};
  const densitySI = toSI("density", v.density, units);
  const massText = parseNumber(v.batchMass);
  const batchMassKg = massText !== null && Number.isFinite(massText) ? (units === "SI" ? massText : massText * 0.45359237) : null;
  const delivery = deliveries.find((d) => d.id === v.deliveryId);
  let yieldText: string | null = null;
  if (densitySI && batchMassKg && num(delivery?.volumeM3)) {
    try {
      const y = concreteYield({ batchMassKg, densityKgM3: densitySI, designVolumeM3: num(delivery?.volumeM3)! });
      yieldText = `Yield ${formatVolume(y.volumeM3, units)}, relative yield ${y.relativeYield.toFixed(3)} (ASTM C138)`;
    } catch {
      yieldText = null;
    }
  }

  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      await createLocal(db, "field-tests", placement.projectId, {
        placementId: placement.id,
        deliveryId: f.deliveryId || null,
        sampledAt: new Date().toISOString(),
        slumpMm: toSI("length", f.slump, units),
        airPct: parseNumber(f.air),
        concreteTempC: toSI("temperature", f.concreteTemp, units),
        airTempC: toSI("temperature", f.airTemp, units),
        densityKgM3: toSI("density", f.density, units),
        notes: [f.notes.trim(), yieldText].filter(Boolean).join(" · ") || null,
      });
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      const map: Record<string, keyof Values> = { slumpMm: "slump", airPct: "air", concreteTempC: "concreteTemp", airTempC: "airTemp", densityKgM3: "density" };
      for (const [key, text] of Object.entries(fields)) setError(map[key] ?? (key as keyof Values), { message: text });
      setFailure(message);
    }
  });

  return (
    <form onSubmit={onSubmit} className="mt-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="field-test-form" noValidate>
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800 sm:col-span-2">
        Sampled truck
        <select data-testid="field-test-delivery" className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal" {...register("deliveryId")}>
          <option value="">Not linked to a truck</option>
          {deliveries.map((d, i) => (
            <option key={d.id} value={d.id}>
              #{i + 1} · ticket {str(d.ticketNumber)}
            </option>
          ))}
        </select>
      </label>
      <div className="flex flex-col gap-1">
        <Field label="Slump" inputMode="decimal" unit={unitLabel("length", units)} error={errors.slump?.message} data-testid="field-test-slump" {...register("slump")} />
        <VerdictLine label="Slump" verdict={verdicts.slump} testId="live-slump-verdict" />
      </div>
      <div className="flex flex-col gap-1">
        <Field label="Air content" inputMode="decimal" unit="%" error={errors.air?.message} data-testid="field-test-air" {...register("air")} />
        <VerdictLine label="Air" verdict={verdicts.air} testId="live-air-verdict" />
      </div>
      <div className="flex flex-col gap-1">
        <Field label="Concrete temperature" inputMode="decimal" unit={unitLabel("temperature", units)} error={errors.concreteTemp?.message} data-testid="field-test-concrete-temp" {...register("concreteTemp")} />
        <VerdictLine label="Temperature" verdict={verdicts.temperature} testId="live-temp-verdict" />
      </div>
      <Field label="Air temperature" inputMode="decimal" unit={unitLabel("temperature", units)} error={errors.airTemp?.message} data-testid="field-test-air-temp" {...register("airTemp")} />
      <Field label="Density (unit weight)" inputMode="decimal" unit={unitLabel("density", units)} error={errors.density?.message} data-testid="field-test-density" {...register("density")} />
      <Field label="Batch mass from the ticket" inputMode="decimal" unit={units === "SI" ? "kg" : "lb"} hint="For the yield; optional" {...register("batchMass")} />
      {yieldText ? <p className="text-sm font-semibold sm:col-span-2" data-testid="field-test-yield">{yieldText}</p> : null}
      <Field label="Notes" className="sm:col-span-2" {...register("notes")} />
      {!mix ? <p className="text-sm text-muted sm:col-span-2">Choose the mix on the plan to check slump and air against it.</p> : null}
      <FindingList findings={live} compact className="sm:col-span-2" testId="field-test-live-findings" />
      <FormFooter failure={failure} saveLabel="Save test" saveTestId="field-test-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

export function FieldTests({ placement, project, mix, checks }: { placement: LocalRecord; project: ProjectRow; mix: LocalRecord | null; checks: FieldFindings | undefined }) {
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
          const results: Results = { slumpMm: num(t.slumpMm), airPct: num(t.airPct), concreteTempC: num(t.concreteTempC) };
          const found = findingsFor(checks?.findings ?? [], "field-test", t.id);
          const verdicts = checks ? verdictsOf(found, results, mix, project, units) : {};
          const truckIndex = (deliveries ?? []).findIndex((d) => d.id === t.deliveryId);
          return (
            <li key={t.id} className="rounded-lg border border-ink-200 p-3" data-testid="field-test-row">
              <p className="flex items-center gap-2 font-bold">
                <FlaskConical className="h-5 w-5 text-ink-600" aria-hidden="true" />
                {truckIndex >= 0 ? `Truck #${truckIndex + 1} (ticket ${str((deliveries ?? [])[truckIndex].ticketNumber)})` : "Sample"} · {formatTime(t.sampledAt, project.timeZone)}
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
                {num(t.airTempC) !== undefined ? (
                  <div>
                    <dt className="text-sm text-muted">Air temperature</dt>
                    <dd className="text-lg font-semibold">{formatTemperature(num(t.airTempC)!, units)}</dd>
                  </div>
                ) : null}
                {num(t.densityKgM3) !== undefined ? (
                  <div>
                    <dt className="text-sm text-muted">Density</dt>
                    <dd className="text-lg font-semibold">{formatDensity(num(t.densityKgM3)!, units)}</dd>
                  </div>
                ) : null}
              </dl>
              {t.notes ? <p className="mt-1 text-sm">{str(t.notes)}</p> : null}
              <FindingList findings={found} className="mt-2" testId="field-test-warning" />
              <RecordPhotos projectId={project.id} recordType="field-tests" recordId={t.id} canAdd={canAddPhotos(project, placement)} title="Test photos" />
            </li>
          );
        })}
      </ul>
    </Section>
  );
}

