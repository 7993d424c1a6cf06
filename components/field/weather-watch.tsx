"use client";

// Weather watch on a placement: readings of air, humidity, wind and concrete temperature, each judged
// by the rulebook (lib/checks) in the project's unit system, the day's cold weather under the
// project's definition, and the hot- and cold-weather checklists.
import { FormFooter } from "./form-footer";
import { useLiveQuery } from "dexie-react-hooks";
import { ClipboardCheck, CloudSun, Plus } from "lucide-react";
import dynamic from "next/dynamic";
import { WhenVisible } from "@/components/ui/when-visible";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { FindingNotice, SeverityChip } from "@/components/findings/finding-notice";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { toCheckMix, toCheckProject, type Finding } from "@/lib/checks";
import { evaporationLimit } from "@/lib/checks/weather";
import { formatSpeed, formatTemperature, type UnitSystem } from "@/lib/concrete";
import { CHECKLIST_KINDS, SUN_EXPOSURES } from "@/lib/records/enums";
import { createLocal, listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { useDeviceWrite } from "./use-device-write";
import { mayWrite, unitSystemOf } from "./field-project";
import { formatDateTime, formatTime, fromLocalInput, toLocalInput } from "./project-time";
import { parseNumber, toSI, unitLabel } from "./unit-inputs";
import { byTime } from "./record-fields";
import { writeErrorOf } from "./write-error";
import { NowInput } from "./now-input";
import { Section } from "./section";
import { draftFindings, findingsFor } from "./findings-model";
import type { FieldFindings } from "./use-findings";
import { Checklist, COLD_ITEMS, HOT_ITEMS } from "./weather-checklist";

// recharts loads on demand (day-chart-plot.tsx), when the chart comes near the screen: it is not
// needed for the first paint.
const DayChartPlot = dynamic(() => import("./day-chart-plot"), { ssr: false });

type Values = { observedAt: string; airTemp: string; rh: string; wind: string; concreteTemp: string; sun: string };

const WEATHER_KINDS = new Set<string>(CHECKLIST_KINDS.filter((k) => k !== "readiness"));
const finite = (x: number | null): x is number => x !== null && Number.isFinite(x);

/** The rulebook's verdict on one reading: the evaporation finding first, then hot weather. */
const readingFindings = (findings: Finding[], id: string) => [...findingsFor(findings, "weather", id, "evaporation"), ...findingsFor(findings, "weather", id, "hot-weather")];

function ObservationForm({ placement, project, checks, onDone }: { placement: LocalRecord<"placements">; project: ProjectRow; checks: FieldFindings | undefined; onDone: () => void }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, setError, formState } = useForm<Values>({
    defaultValues: { observedAt: toLocalInput(new Date(), project.timeZone), airTemp: "", rh: "", wind: "", concreteTemp: "", sun: "sun" },
  });
  useDirtyGuard("weather-new", formState.isDirty);
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const draft = {
    placementId: placement.id,
    observedAt: fromLocalInput(v.observedAt, project.timeZone) ?? new Date().toISOString(),
    airTempC: toSI("temperature", v.airTemp, units),
    relativeHumidityPct: parseNumber(v.rh),
    windKmh: toSI("speed", v.wind, units),
    concreteTempC: toSI("temperature", v.concreteTemp, units),
  };
  const readable = checks && finite(draft.airTempC) && finite(draft.relativeHumidityPct) && finite(draft.windKmh) && (draft.concreteTempC === null || finite(draft.concreteTempC));
  const live = readable ? readingFindings(draftFindings(checks.records, "weather", draft, new Date()), "draft") : [];

  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      await createLocal(db, "weather-observations", placement.projectId, {
        placementId: placement.id,
        observedAt: fromLocalInput(f.observedAt, project.timeZone) ?? "",
        airTempC: toSI("temperature", f.airTemp, units),
        relativeHumidityPct: parseNumber(f.rh),
        windKmh: toSI("speed", f.wind, units),
        concreteTempC: toSI("temperature", f.concreteTemp, units),
        sun: f.sun || null,
      });
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      const map: Record<string, keyof Values> = { airTempC: "airTemp", relativeHumidityPct: "rh", windKmh: "wind", concreteTempC: "concreteTemp" };
      for (const [key, text] of Object.entries(fields)) setError(map[key] ?? (key as keyof Values), { message: text });
      setFailure(message);
    }
  });

  return (
    <form onSubmit={onSubmit} className="mt-3 grid grid-cols-1 gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="weather-form" noValidate>
      <NowInput label="Observed" type="datetime-local" value={v.observedAt} onChange={(x) => setValue("observedAt", x, { shouldDirty: true })} error={errors.observedAt?.message} timeZone={project.timeZone} testId="weather-observed-at" />
      <Field label="Air temperature" inputMode="decimal" unit={unitLabel("temperature", units)} error={errors.airTemp?.message} data-testid="weather-air-temp" {...register("airTemp")} />
      <Field label="Relative humidity" inputMode="decimal" unit="%" error={errors.rh?.message} data-testid="weather-rh" {...register("rh")} />
      <Field label="Wind (average, not gusts)" inputMode="decimal" unit={unitLabel("speed", units)} error={errors.wind?.message} data-testid="weather-wind" {...register("wind")} />
      <Field
        label="Concrete temperature"
        inputMode="decimal"
        unit={unitLabel("temperature", units)}
        hint="Blank: the air temperature stands in, and the rate is marked as an estimate"
        error={errors.concreteTemp?.message}
        data-testid="weather-concrete-temp"
        {...register("concreteTemp")}
      />
      <fieldset className="min-w-0">
        <legend className="text-sm font-semibold text-ink-800">Sun on the work</legend>
        <div className="mt-1 grid grid-cols-3 gap-2">
          {SUN_EXPOSURES.map((s) => (
            <label key={s} className="flex min-h-touch items-center justify-center gap-1 rounded-lg border border-ink-300 px-2 font-semibold has-[:checked]:border-lichen-700 has-[:checked]:bg-lichen-50">
              <input type="radio" value={s} className="sr-only" {...register("sun")} />
              {s === "sun" ? "Sun" : s === "shade" ? "Shade" : "Overcast"}
            </label>
          ))}
        </div>
      </fieldset>
      {live.length > 0 ? (
        <div className="flex flex-col gap-2 sm:col-span-2" data-testid="weather-live-rate">
          <SeverityChip severity={live[0].severity} testId="weather-live-risk" />
          {live.map((f) => (
            <FindingNotice key={f.rule} finding={f} compact testId="weather-live-finding" />
          ))}
        </div>
      ) : null}
      <FormFooter failure={failure} saveLabel="Save observation" saveTestId="weather-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

function DayChart({ points, units, highAt }: { points: { time: string; rate: number }[]; units: UnitSystem; highAt: number }) {
  if (points.length < 1) return null;
  const top = Math.max(highAt * 1.3, ...points.map((p) => p.rate));
  return (
    <figure className="m-0 mt-3" data-testid="weather-chart" aria-label={`Evaporation rate through the day, ${unitLabel("evaporationRate", units)}`}>
      <figcaption className="text-sm font-semibold">Evaporation rate by reading ({unitLabel("evaporationRate", units)})</figcaption>
      <div aria-hidden="true" className="h-44 w-full">
        <WhenVisible placeholder={null} className="h-full w-full">
          <DayChartPlot points={points} top={Number(top.toFixed(units === "SI" ? 2 : 3))} high={highAt} />
        </WhenVisible>
      </div>
    </figure>
  );
}

export function WeatherWatch({ placement, project, mix, checks }: { placement: LocalRecord<"placements">; project: ProjectRow; mix: LocalRecord<"mix-designs"> | null; checks: FieldFindings | undefined }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const observations = useLiveQuery(async () => (await listByParent(db, "weather-observations", "placementId", placement.id)).sort(byTime("observedAt")), [db, placement.id]);
  const checklists = useLiveQuery(() => listByParent(db, "checklists", "placementId", placement.id), [db, placement.id]);
  const [adding, setAdding] = useState(false);
  const { error, run } = useDeviceWrite();
  const [starting, setStarting] = useState(false);
  const canObserve = mayWrite(project, "weather.write");
  const canCheck = mayWrite(project, "checklist.write");
  const findings = checks?.findings ?? [];

  const rows = (observations ?? []).map((o) => ({ o, found: readingFindings(findings, o.id) }));
  const hot = rows.some((r) => r.found.some((f) => f.severity === "warning" || f.rule === "hot-weather"));
  const cold = findings.filter((f) => f.rule === "cold-weather");
  const has = (kind: string) => (checklists ?? []).some((c) => c.kind === kind);
  const highAt = evaporationLimit(toCheckProject(project), mix ? toCheckMix(mix) : null).highAt;
  const points = rows.flatMap(({ o, found }) => {
    const rate = found.find((f) => f.rule === "evaporation")?.applied.value;
    return typeof rate === "number" ? [{ time: formatTime(o.observedAt, project.timeZone), rate: Number(rate.toFixed(units === "SI" ? 2 : 3)) }] : [];
  });

  const start = async (kind: "hot-weather" | "cold-weather") => {
    setStarting(true);
    await run(async () => {
      const { id } = await createLocal(db, "checklists", placement.projectId, { placementId: placement.id, kind });
      for (const [itemKey, label] of kind === "hot-weather" ? HOT_ITEMS : COLD_ITEMS) {
        await createLocal(db, "checklist-items", placement.projectId, { checklistId: id, itemKey, label });
      }
    });
    setStarting(false);
  };

  return (
    <Section
      title="Weather watch"
      testId="weather-watch"
      actions={
        !adding && canObserve ? (
          <Button data-testid="add-weather" onClick={() => setAdding(true)}>
            <Plus className="h-5 w-5" aria-hidden="true" /> Add an observation
          </Button>
        ) : null
      }
    >
      {adding ? <ObservationForm placement={placement} project={project} checks={checks} onDone={() => setAdding(false)} /> : null}
      {checks?.error ? (
        <Notice tone="danger" title="The readings could not be checked" className="mb-2">
          {checks.error}
        </Notice>
      ) : null}
      {rows.length === 0 && !adding ? <p className="text-muted">No observations yet.</p> : null}
      <ul className="mt-3 flex flex-col gap-2">
        {rows.map(({ o, found }) => (
          <li key={o.id} className="rounded-lg border border-ink-200 p-3" data-testid="weather-row">
            <p className="flex flex-wrap items-center gap-2">
              <CloudSun className="h-5 w-5 text-ink-600" aria-hidden="true" />
              <span className="font-bold">{formatDateTime(o.observedAt, project.timeZone)}</span>
              <span>
                air {typeof o.airTempC === "number" ? formatTemperature(o.airTempC, units) : "—"} · {o.relativeHumidityPct ?? "—"} % RH · wind{" "}
                {typeof o.windKmh === "number" ? formatSpeed(o.windKmh, units) : "—"}
                {typeof o.concreteTempC === "number" ? ` · concrete ${formatTemperature(o.concreteTempC, units)}` : " · concrete not measured"}
                {o.sun ? ` · ${o.sun}` : ""}
              </span>
            </p>
            <div className="mt-2 flex flex-col gap-2">
              {found.map((f) => (
                <FindingNotice key={f.rule} finding={f} compact={f.severity !== "warning"} testId={f.rule === "evaporation" && f.severity === "warning" ? "weather-high-risk" : "weather-finding"} />
              ))}
            </div>
            <RecordPhotos projectId={project.id} recordType="weather-observations" recordId={o.id} canAdd={canAddPhotos(project, placement)} />
          </li>
        ))}
      </ul>
      {cold.map((f) => (
        <FindingNotice key={f.subject.id} finding={f} className="mt-3" testId="weather-cold" />
      ))}
      {hot && canCheck && !has("hot-weather") ? (
        <Button className="mt-3" data-testid="start-hot-checklist" disabled={starting} onClick={() => void start("hot-weather")}>
          <ClipboardCheck className="h-5 w-5" aria-hidden="true" /> Start the hot-weather checklist
        </Button>
      ) : null}
      {cold.length > 0 && canCheck && !has("cold-weather") ? (
        <Button className="mt-3" data-testid="start-cold-checklist" disabled={starting} onClick={() => void start("cold-weather")}>
          <ClipboardCheck className="h-5 w-5" aria-hidden="true" /> Start the cold-weather checklist
        </Button>
      ) : null}
      {error ? (
        <Notice tone="danger" title="Not saved" className="mt-2">
          {error}
        </Notice>
      ) : null}
      <DayChart points={points} units={units} highAt={highAt} />
      {/* Only the weather checklists: the readiness check has its own section (one checklist, one place). */}
      {(checklists ?? [])
        .filter((c) => WEATHER_KINDS.has(c.kind))
        .map((c) => (
          <Checklist key={c.id} checklist={c} canWrite={canCheck} />
        ))}
    </Section>
  );
}
