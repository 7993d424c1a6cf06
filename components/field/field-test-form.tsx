"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { FindingList } from "@/components/findings/finding-notice";
import { nominalCylinderText } from "@/components/lab/format";
import { Field } from "@/components/ui/field";
import { concreteYield, formatVolume, type UnitSystem } from "@/lib/concrete";
import { CYLINDER_DIAMETERS_MM } from "@/lib/records/enums";
import { SetLoggerSelect } from "@/components/maturity/set-logger-select";
import { createLocal, listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { writeTx } from "@/lib/sync/client/mutate";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { unitSystemOf } from "./field-project";
import { fromLocalInput, toLocalInput } from "./project-time";
import { parseNumber, toSI, unitLabel } from "./unit-inputs";
import { writeErrorOf } from "./write-error";
import { NowInput } from "./now-input";
import { VerdictLine, verdictsOf, type Results } from "./field-test-verdicts";
import { draftFindings } from "./findings-model";
import { FormFooter } from "./form-footer";
import type { FieldFindings } from "./use-findings";

/** The usual breaks: 7 days, and the mix's design age (28 days unless the mix says otherwise). */
function defaultTestAges(mix: LocalRecord<"mix-designs"> | null): string {
  const design = mix?.fcAgeDays ?? 28;
  return [...new Set([7, design])].sort((a, b) => a - b).join(", ");
}

// ASTM C31: cylinders twice as long as their diameter; inch-pound jobs mould 4 × 8 in and 6 × 12 in.
const cylinderLengthMm = (diameterMm: number, units: UnitSystem) => (units === "IP" ? (diameterMm >= 150 ? 304.8 : 203.2) : diameterMm * 2);

/** "7, 28" → [7, 28]; anything that is not a number is kept as NaN so the schema names the field. */
const parseAges = (text: string) => text.split(/[,\s]+/).filter(Boolean).map((x) => Number(x));

type Values = {
  deliveryId: string;
  sampledAt: string;
  testedBy: string;
  slump: string;
  air: string;
  concreteTemp: string;
  airTemp: string;
  density: string;
  batchMass: string;
  notes: string;
  cylinders: string;
  cylinderDiameterMm: string;
  setCode: string;
  testAges: string;
  sensorId: string;
};

// Where a refused field of the test or of its specimen set is shown in this form.
const FIELD_OF: Record<string, keyof Values> = {
  slumpMm: "slump", airPct: "air", concreteTempC: "concreteTemp", airTempC: "airTemp", densityKgM3: "density",
  count: "cylinders", testAgesDays: "testAges", cylinderDiameterMm: "cylinderDiameterMm",
};

export function FieldTestForm({
  placement,
  project,
  mix,
  deliveries,
  checks,
  onDone,
}: {
  placement: LocalRecord<"placements">;
  project: ProjectRow;
  mix: LocalRecord<"mix-designs"> | null;
  deliveries: LocalRecord<"deliveries">[];
  checks: FieldFindings | undefined;
  onDone: () => void;
}) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, setValue, formState } = useForm<Values>({
    defaultValues: {
      deliveryId: deliveries[deliveries.length - 1]?.id ?? "",
      sampledAt: toLocalInput(new Date(), project.timeZone),
      testedBy: "",
      slump: "", air: "", concreteTemp: "", airTemp: "", density: "", batchMass: "", notes: "",
      cylinders: "",
      cylinderDiameterMm: "150",
      setCode: "",
      testAges: defaultTestAges(mix),
      sensorId: "",
    },
  });
  useDirtyGuard("field-test-new", formState.isDirty);
  const sensors = useLiveQuery(() => listByParent(db, "temperature-sensors", "placementId", placement.id), [db, placement.id]) ?? [];
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const results: Results = {
    slumpMm: toSI("length", v.slump, units) ?? undefined,
    airPct: parseNumber(v.air) ?? undefined,
    concreteTempC: toSI("temperature", v.concreteTemp, units) ?? undefined,
  };
  const clean = (r: Results): Results => Object.fromEntries(Object.entries(r).filter(([, x]) => typeof x === "number" && Number.isFinite(x)));
  const measured = clean(results);
  const draft = { placementId: placement.id, deliveryId: v.deliveryId || null, sampledAt: fromLocalInput(v.sampledAt, project.timeZone) ?? new Date().toISOString(), slumpMm: measured.slumpMm ?? null, airPct: measured.airPct ?? null, concreteTempC: measured.concreteTempC ?? null };
  const live = checks ? draftFindings(checks.records, "fieldTests", draft, new Date()) : [];
  const verdicts = checks ? verdictsOf(live, measured, mix, project, units) : {};
  const densitySI = toSI("density", v.density, units);
  const massText = parseNumber(v.batchMass);
  const batchMassKg = massText !== null && Number.isFinite(massText) ? (units === "SI" ? massText : massText * 0.45359237) : null;
  const delivery = deliveries.find((d) => d.id === v.deliveryId);
  let yieldText: string | null = null;
  if (densitySI && batchMassKg && delivery?.volumeM3) {
    try {
      const y = concreteYield({ batchMassKg, densityKgM3: densitySI, designVolumeM3: delivery.volumeM3 });
      yieldText = `Yield ${formatVolume(y.volumeM3, units)}, relative yield ${y.relativeYield.toFixed(3)} (ASTM C138)`;
    } catch {
      yieldText = null;
    }
  }

  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    const sampledAt = fromLocalInput(f.sampledAt, project.timeZone) ?? "";
    const cylinders = parseNumber(f.cylinders);
    try {
      // The test and the cylinders made from its sample are saved together or not at all.
      await writeTx(db, async () => {
      await createLocal(db, "field-tests", placement.projectId, {
        placementId: placement.id,
        deliveryId: f.deliveryId || null,
        sampledAt,
        testedBy: f.testedBy.trim() || null,
        slumpMm: toSI("length", f.slump, units),
        airPct: parseNumber(f.air),
        concreteTempC: toSI("temperature", f.concreteTemp, units),
        airTempC: toSI("temperature", f.airTemp, units),
        densityKgM3: toSI("density", f.density, units),
        notes: [f.notes.trim(), yieldText].filter(Boolean).join(" · ") || null,
      });
      if (cylinders !== null) {
        const diameterMm = Number(f.cylinderDiameterMm);
        await createLocal(db, "specimen-sets", placement.projectId, {
          placementId: placement.id,
          deliveryId: f.deliveryId || null,
          setCode: f.setCode.trim(),
          cylinderDiameterMm: diameterMm,
          cylinderLengthMm: cylinderLengthMm(diameterMm, units),
          count: cylinders,
          castAt: sampledAt,
          testAgesDays: parseAges(f.testAges),
          sensorId: f.sensorId || null,
        });
      }
      });
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      for (const [key, text] of Object.entries(fields)) setError(FIELD_OF[key] ?? (key as keyof Values), { message: text });
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
              #{i + 1} · ticket {d.ticketNumber}
            </option>
          ))}
        </select>
      </label>
      <NowInput
        label="Test time"
        type="datetime-local"
        value={v.sampledAt}
        onChange={(x) => setValue("sampledAt", x, { shouldDirty: true })}
        error={errors.sampledAt?.message}
        timeZone={project.timeZone}
        testId="field-test-sampled-at"
      />
      <Field label="Tested by" placeholder="Name of the technician" error={errors.testedBy?.message} data-testid="field-test-tested-by" {...register("testedBy")} />
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
      <fieldset className="grid gap-3 rounded-lg border border-ink-200 p-3 sm:col-span-2 sm:grid-cols-2" data-testid="field-test-cylinders">
        <legend className="px-1 text-sm font-semibold text-ink-800">Cylinders made from this sample</legend>
        <Field label="Number of cylinders" inputMode="numeric" hint="Leave empty when none were made" error={errors.cylinders?.message} data-testid="field-test-cylinder-count" {...register("cylinders")} />
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
          Size
          <select data-testid="field-test-cylinder-size" className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal" {...register("cylinderDiameterMm")}>
            {CYLINDER_DIAMETERS_MM.map((d) => (
              <option key={d} value={d}>
                {nominalCylinderText(d, cylinderLengthMm(d, units), units)}
              </option>
            ))}
          </select>
        </label>
        {v.cylinders.trim() ? (
          <>
            <Field label="Set id" placeholder="as written on the cylinders" error={errors.setCode?.message} data-testid="field-test-set-code" {...register("setCode")} />
            <Field label="Test ages" unit="days" hint="Separated by commas" error={errors.testAges?.message} data-testid="field-test-ages" {...register("testAges")} />
            <SetLoggerSelect sensors={sensors} error={errors.sensorId?.message} testId="field-test-set-logger" {...register("sensorId")} />
          </>
        ) : null}
      </fieldset>
      {!mix ? <p className="text-sm text-muted sm:col-span-2">Choose the mix on the plan to check slump and air against it.</p> : null}
      <FindingList findings={live} compact className="sm:col-span-2" testId="field-test-live-findings" />
      <FormFooter failure={failure} saveLabel="Save test" saveTestId="field-test-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

