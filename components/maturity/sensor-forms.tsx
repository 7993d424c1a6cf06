"use client";

import { FileUp, Plus, Thermometer } from "lucide-react";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { FormFooter } from "@/components/field/form-footer";
import { unitSystemOf } from "@/components/field/field-project";
import { fromLocalInput, toLocalInput } from "@/components/field/project-time";
import { toSI, unitLabel } from "@/components/field/unit-inputs";
import { writeErrorOf } from "@/components/field/write-error";
import { NowInput } from "@/components/field/now-input";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { createLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { CsvImport } from "./csv-import";

type SensorValues = { name: string; location: string; interval: string };

export function SensorForm({ placement, onDone }: { placement: LocalRecord<"placements">; onDone: () => void }) {
  const db = useSyncDb();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SensorValues>({ defaultValues: { name: "", location: "", interval: "" } });
  useDirtyGuard("sensor-new", formState.isDirty);
  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      await createLocal(db, "temperature-sensors", placement.projectId, {
        placementId: placement.id,
        name: f.name.trim(),
        location: f.location.trim(),
        loggingIntervalMinutes: f.interval.trim() ? Number(f.interval) : null,
      });
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      for (const [key, text] of Object.entries(fields)) setError(key === "loggingIntervalMinutes" ? "interval" : (key as keyof SensorValues), { message: text });
      setFailure(message);
    }
  });
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} className="mb-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-3" data-testid="sensor-form" noValidate>
      <Field label="Sensor name" placeholder="e.g. T1" error={e.name?.message} data-testid="sensor-name" {...register("name")} />
      <Field label="Where it sits" placeholder="e.g. east edge, mid-depth" error={e.location?.message} data-testid="sensor-location" {...register("location")} />
      <Field label="Logging interval" inputMode="numeric" unit="min" hint="Blank for hand readings" error={e.interval?.message} {...register("interval")} />
      <FormFooter failure={failure} saveLabel="Save sensor" saveTestId="sensor-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

type ReadingValues = { at: string; temp: string };

function ReadingForm({ sensor, project, onDone }: { sensor: LocalRecord<"temperature-sensors">; project: ProjectRow; onDone: () => void }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, formState } = useForm<ReadingValues>({ defaultValues: { at: toLocalInput(new Date(), project.timeZone), temp: "" } });
  const at = useWatch({ control, name: "at" });
  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      const tempC = toSI("temperature", f.temp, units);
      // The project's wall clock (lib/time/zone through components/field/project-time.ts), whatever zone the phone is set to.
      const when = fromLocalInput(f.at, project.timeZone);
      await createLocal(db, "sensor-readings", sensor.projectId, { sensorId: sensor.id, source: "manual", readings: [[when ?? "", tempC]] });
      onDone();
    } catch (error) {
      setFailure(writeErrorOf(error).message);
    }
  });
  return (
    <form onSubmit={onSubmit} className="mt-2 grid gap-3 sm:grid-cols-2" data-testid="reading-form" noValidate>
      <NowInput label="Read at" type="datetime-local" value={at} onChange={(x) => setValue("at", x)} timeZone={project.timeZone} testId="reading-at" />
      <Field label="Temperature" inputMode="decimal" unit={unitLabel("temperature", units)} data-testid="reading-temp" {...register("temp")} />
      <FormFooter failure={failure} saveLabel="Save reading" saveTestId="reading-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

export function SensorRow({ sensor, project, canWrite, readings }: { sensor: LocalRecord<"temperature-sensors">; project: ProjectRow; canWrite: boolean; readings: number }) {
  const [mode, setMode] = useState<"idle" | "reading" | "import">("idle");
  const interval = sensor.loggingIntervalMinutes;
  return (
    <li className="rounded-lg border border-ink-200 p-3" data-testid="sensor-row" data-sensor={sensor.name}>
      <div className="flex flex-wrap items-center gap-2">
        <Thermometer className="h-5 w-5 text-ink-600" aria-hidden="true" />
        <span className="text-lg font-bold">{sensor.name}</span>
        <span className="text-sm text-muted">
          {[sensor.location, interval ? `every ${interval} min` : "hand readings", `${readings} reading${readings === 1 ? "" : "s"}`].filter(Boolean).join(" · ")}
        </span>
        {canWrite && mode === "idle" ? (
          <span className="ml-auto flex gap-2">
            <Button variant="secondary" data-testid="add-reading" onClick={() => setMode("reading")}>
              <Plus className="h-4 w-4" aria-hidden="true" /> Reading
            </Button>
            <Button variant="secondary" data-testid="import-csv" onClick={() => setMode("import")}>
              <FileUp className="h-4 w-4" aria-hidden="true" /> Import CSV
            </Button>
          </span>
        ) : null}
      </div>
      {mode === "reading" ? <ReadingForm sensor={sensor} project={project} onDone={() => setMode("idle")} /> : null}
      {mode === "import" ? <CsvImport sensor={sensor} project={project} onDone={() => setMode("idle")} /> : null}
    </li>
  );
}
