"use client";

import { FormFooter } from "./form-footer";
import { useLiveQuery } from "dexie-react-hooks";
import { Plus, Thermometer } from "lucide-react";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FindingNotice } from "@/components/findings/finding-notice";
import { coldWeatherCautions, curingMinimumC } from "@/lib/checks/cold-weather";
import { formatLength, formatTemperature } from "@/lib/concrete";
import { createLocal, listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { mayWrite, unitSystemOf } from "./field-project";
import { formatDateTime, fromLocalInput, toLocalInput } from "./project-time";
import { toSI, unitLabel } from "./unit-inputs";
import { byTime } from "./record-fields";
import { writeErrorOf } from "./write-error";
import { Verdict } from "./verdict-badges";
import { NowInput } from "./now-input";
import { Section } from "./section";
import { findingsFor } from "./findings-model";
import type { FieldFindings } from "./use-findings";

type Values = { method: string; readAt: string; temp: string; location: string; note: string };

function ReadingForm({ placement, project, onDone }: { placement: LocalRecord<"placements">; project: ProjectRow; onDone: () => void }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, setError, formState } = useForm<Values>({
    defaultValues: { method: "Insulated blankets", readAt: toLocalInput(new Date(), project.timeZone), temp: "", location: "", note: "" },
  });
  useDirtyGuard("curing-new", formState.isDirty);
  const errors = formState.errors;
  const readAt = useWatch({ control, name: "readAt" });
  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      await createLocal(db, "curing-readings", placement.projectId, {
        placementId: placement.id,
        method: f.method.trim(),
        readAt: fromLocalInput(f.readAt, project.timeZone) ?? "",
        tempC: toSI("temperature", f.temp, units),
        location: f.location.trim() || undefined,
        note: f.note.trim() || null,
      });
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      for (const [key, text] of Object.entries(fields)) setError(key === "tempC" ? "temp" : (key as keyof Values), { message: text });
      setFailure(message);
    }
  });
  return (
    <form onSubmit={onSubmit} className="mt-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="curing-form" noValidate>
      <Field label="Protection or curing method" error={errors.method?.message} {...register("method")} />
      <NowInput label="Read at" type="datetime-local" value={readAt} onChange={(x) => setValue("readAt", x, { shouldDirty: true })} error={errors.readAt?.message} timeZone={project.timeZone} testId="curing-read-at" />
      <Field label="Concrete temperature" inputMode="decimal" unit={unitLabel("temperature", units)} error={errors.temp?.message} data-testid="curing-temp" {...register("temp")} />
      <Field label="Location" placeholder="e.g. NE corner, under blanket" error={errors.location?.message} {...register("location")} />
      <Field label="Note" className="sm:col-span-2" {...register("note")} />
      <FormFooter failure={failure} saveLabel="Save reading" saveTestId="curing-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

export function CuringLog({ placement, project, checks }: { placement: LocalRecord<"placements">; project: ProjectRow; checks: FieldFindings | undefined }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const readings = useLiveQuery(async () => (await listByParent(db, "curing-readings", "placementId", placement.id)).sort(byTime("readAt")), [db, placement.id]);
  // Cold weather as the rulebook finds it under the project's definition, on this placement's days.
  const cold = (checks?.findings ?? []).filter((f) => f.rule === "cold-weather");
  const [adding, setAdding] = useState(false);
  const least = placement.leastDimensionMm ?? undefined;
  const canWrite = mayWrite(project, "curing.write");
  const minimum = curingMinimumC({ leastDimensionMm: least ?? null }, units);

  return (
    <Section
      title="Protection & curing"
      testId="curing-log"
      actions={
        !adding && canWrite ? (
          <Button data-testid="add-curing" onClick={() => setAdding(true)}>
            <Plus className="h-5 w-5" aria-hidden="true" /> Add a reading
          </Button>
        ) : null
      }
    >
      <p className="text-base" data-testid="curing-minimum">
        {minimum !== null && least !== undefined ? (
          <>
            Minimum concrete temperature for a {formatLength(least, units)} section: <strong>{formatTemperature(minimum, units)}</strong> (ACI 306R,
            minimum by least section dimension). The project specification, local codes and the engineer of record govern.
          </>
        ) : (
          "Enter the least dimension on the plan to see the minimum temperature for the section."
        )}
      </p>
      {cold.map((f) => (
        <FindingNotice key={f.subject.id} finding={f} compact className="mt-3" testId="curing-co-caution" />
      ))}
      {adding ? <ReadingForm placement={placement} project={project} onDone={() => setAdding(false)} /> : null}
      <ul className="mt-3 flex flex-col gap-2">
        {(readings ?? []).map((r) => {
          const t = r.tempC;
          const low = findingsFor(checks?.findings ?? [], "curing", r.id);
          return (
            <li key={r.id} className="flex flex-wrap items-center gap-2 rounded-lg border border-ink-200 p-3" data-testid="curing-row">
              <Thermometer className="h-5 w-5 text-ink-600" aria-hidden="true" />
              <span className="text-lg font-bold">{t !== undefined ? formatTemperature(t, units) : "—"}</span>
              {minimum !== null && checks ? <Verdict ok={low.length === 0} okText="At or above the minimum" badText="Below the minimum" testId="curing-verdict" /> : null}
              <span className="text-sm text-muted">
                {formatDateTime(r.readAt, project.timeZone)} · {r.method}
                {r.location ? ` · ${r.location}` : ""}
              </span>
              {low.map((f) => (
                <FindingNotice key={f.rule} finding={f} compact className="basis-full" testId="curing-finding" />
              ))}
              <div className="basis-full">
                <RecordPhotos projectId={project.id} recordType="curing-readings" recordId={r.id} canAdd={canAddPhotos(project, placement)} />
              </div>
            </li>
          );
        })}
      </ul>
      {cold.length === 0 ? (
        // The rulebook's heater caution (lib/checks), the words the cold-weather finding carries.
        <p className="mt-3 text-sm text-muted" data-testid="curing-heater-caution">
          <span className="font-medium">In cold weather:</span> {coldWeatherCautions(units)[0]}
        </p>
      ) : null}
    </Section>
  );
}
