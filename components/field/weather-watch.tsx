"use client";

import { FormFooter } from "./form-footer";
import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { CircleCheck, ClipboardCheck, CloudSun, OctagonAlert, Plus, TriangleAlert } from "lucide-react";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { CartesianGrid, Line, LineChart, ReferenceLine, XAxis, YAxis } from "recharts";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { describeEvaporation, formatEvaporation, formatSpeed, formatTemperature, toDisplay, type EvaporationRisk, type UnitSystem } from "@/lib/concrete";
import { SUN_EXPOSURES } from "@/lib/records/enums";
import { createLocal, listByParent, updateLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { NowInput, Section, mayWrite, byTime, formatTime, fromLocalInput, num, parseNumber, str, toLocalInput, toSI, unitLabel, unitSystemOf, writeErrorOf } from "./common";
import { paletteHex } from "@/lib/ui/palette";
import { SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";

export const COLD_AIR_C = 4;

const HOT_ITEMS: [string, string][] = [
  ["materials-cooled", "Materials cooled or shaded; retarder as the mix allows"],
  ["placing-time", "Placing planned for the cooler hours"],
  ["subgrade-dampened", "Subgrade and forms dampened, no standing water"],
  ["windbreaks-shade", "Windbreaks and sunshades up"],
  ["fogging-ready", "Fogging or evaporation reducer on site"],
  ["curing-ready", "Curing materials ready to start at once after finishing"],
  ["cylinders-shaded", "Test cylinders shaded and kept in their curing range"],
  ["crew-heat", "Crew water, shade and rest breaks arranged"],
];
const COLD_ITEMS: [string, string][] = [
  ["no-frozen-ground", "No frost or ice on the subgrade, forms or reinforcement"],
  ["heaters-vented", "Combustion heaters vented outside (carbon monoxide)"],
  ["enclosure-ready", "Enclosure or insulated blankets ready"],
  ["concrete-temp", "Concrete temperature at delivery at or above the minimum for the section"],
  ["thermometers", "Thermometers placed to log the protection period"],
  ["protection-removal", "Plan to remove protection gradually"],
  ["cylinders-protected", "Test cylinders protected from freezing"],
];

type Evap = { rateSI: number; risk: EvaporationRisk; rule: string; actions: string[] };

export function evaporationOf(o: { airTempC?: number; relativeHumidityPct?: number; windKmh?: number; concreteTempC?: number }, project: ProjectRow, lowBleed: boolean): Evap | null {
  if (o.airTempC === undefined || o.relativeHumidityPct === undefined || o.windKmh === undefined) return null;
  const highAt = num(project.evaporationHighKgM2H);
  try {
    const d = describeEvaporation({
      unitSystem: "SI",
      airTempC: o.airTempC,
      concreteTempC: o.concreteTempC ?? o.airTempC,
      relativeHumidityPct: o.relativeHumidityPct,
      windKmh: o.windKmh,
      lowBleed,
      ...(highAt !== undefined ? { highAt, cautionAt: highAt / 2 } : {}),
    });
    return { rateSI: d.rate, risk: d.risk, rule: d.rule, actions: d.actions };
  } catch {
    return null;
  }
}

const RISK_LOOK: Record<EvaporationRisk, { words: string; icon: typeof CircleCheck; box: string }> = {
  low: { words: "Low risk", icon: CircleCheck, box: TONES.done.className },
  caution: { words: "Caution", icon: TriangleAlert, box: TONES[SEVERITY_WORDS.caution.tone].className },
  high: { words: "High risk", icon: OctagonAlert, box: TONES[SEVERITY_WORDS.warning.tone].className },
};

export function RiskBadge({ risk, testId }: { risk: EvaporationRisk; testId?: string }) {
  const look = RISK_LOOK[risk];
  const Icon = look.icon;
  return (
    <span data-testid={testId} data-risk={risk} className={clsx("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold", look.box)}>
      <Icon className="h-4 w-4" aria-hidden="true" />
      {look.words}
    </span>
  );
}

type Values = { observedAt: string; airTemp: string; rh: string; wind: string; concreteTemp: string; sun: string };

function ObservationForm({ placement, project, lowBleed, onDone }: { placement: LocalRecord; project: ProjectRow; lowBleed: boolean; onDone: () => void }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, setError, formState } = useForm<Values>({
    defaultValues: { observedAt: toLocalInput(new Date()), airTemp: "", rh: "", wind: "", concreteTemp: "", sun: "sun" },
  });
  useDirtyGuard("weather-new", formState.isDirty);
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const evap = evaporationOf(
    {
      airTempC: toSI("temperature", v.airTemp, units) ?? undefined,
      relativeHumidityPct: parseNumber(v.rh) ?? undefined,
      windKmh: toSI("speed", v.wind, units) ?? undefined,
      concreteTempC: toSI("temperature", v.concreteTemp, units) ?? undefined,
    },
    project,
    lowBleed,
  );

  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    try {
      await createLocal(db, "weather-observations", placement.projectId, {
        placementId: placement.id,
        observedAt: fromLocalInput(f.observedAt) ?? "",
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
    <form onSubmit={onSubmit} className="mt-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="weather-form" noValidate>
      <NowInput label="Observed" type="datetime-local" value={v.observedAt} onChange={(x) => setValue("observedAt", x, { shouldDirty: true })} error={errors.observedAt?.message} />
      <Field label="Air temperature" inputMode="decimal" unit={unitLabel("temperature", units)} error={errors.airTemp?.message} data-testid="weather-air-temp" {...register("airTemp")} />
      <Field label="Relative humidity" inputMode="decimal" unit="%" error={errors.rh?.message} data-testid="weather-rh" {...register("rh")} />
      <Field label="Wind (average, not gusts)" inputMode="decimal" unit={unitLabel("speed", units)} error={errors.wind?.message} data-testid="weather-wind" {...register("wind")} />
      <Field label="Concrete temperature" inputMode="decimal" unit={unitLabel("temperature", units)} hint="Blank: the air temperature is used" error={errors.concreteTemp?.message} data-testid="weather-concrete-temp" {...register("concreteTemp")} />
      <fieldset>
        <legend className="text-sm font-semibold text-ink-800">Sun</legend>
        <div className="mt-1 grid grid-cols-3 gap-2">
          {SUN_EXPOSURES.map((s) => (
            <label key={s} className="flex min-h-touch items-center justify-center gap-1 rounded-lg border border-ink-300 px-2 font-semibold has-[:checked]:border-lichen-700 has-[:checked]:bg-lichen-50">
              <input type="radio" value={s} className="sr-only" {...register("sun")} />
              {s === "sun" ? "Sun" : s === "shade" ? "Shade" : "Overcast"}
            </label>
          ))}
        </div>
      </fieldset>
      {evap ? (
        <div className="flex flex-wrap items-center gap-2 sm:col-span-2" data-testid="weather-live-rate">
          <span className="text-2xl font-bold">{formatEvaporation(evap.rateSI, units)}</span>
          <RiskBadge risk={evap.risk} testId="weather-live-risk" />
          <span className="text-sm text-muted">{evap.rule}. The project specification governs.</span>
        </div>
      ) : null}
      <FormFooter failure={failure} saveLabel="Save observation" saveTestId="weather-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

function DayChart({ points, units, highSI }: { points: { time: string; rate: number }[]; units: UnitSystem; highSI: number }) {
  if (points.length < 1) return null;
  const high = toDisplay("evaporationRate", highSI, units);
  const top = Math.max(high * 1.3, ...points.map((p) => p.rate));
  return (
    <figure className="m-0 mt-3" data-testid="weather-chart" aria-label={`Evaporation rate through the day, ${unitLabel("evaporationRate", units)}`}>
      <figcaption className="text-sm font-semibold">Evaporation rate today ({unitLabel("evaporationRate", units)})</figcaption>
      <div aria-hidden="true" className="h-44 w-full">
        <LineChart responsive data={points} margin={{ top: 8, right: 12, bottom: 4, left: 0 }} style={{ width: "100%", height: "100%" }}>
          <CartesianGrid stroke={paletteHex("ink-200")} strokeDasharray="3 3" />
          <XAxis dataKey="time" stroke={paletteHex("ink-600")} fontSize={12} />
          <YAxis domain={[0, Number(top.toFixed(2))]} stroke={paletteHex("ink-600")} fontSize={12} width={40} />
          <ReferenceLine y={high} stroke={paletteHex("danger-700")} strokeDasharray="6 3" label={{ value: "high", fill: paletteHex("danger-700"), fontSize: 12, position: "insideTopRight" }} />
          <Line type="monotone" dataKey="rate" stroke={paletteHex("lichen-600")} strokeWidth={3} dot={{ r: 4 }} isAnimationActive={false} />
        </LineChart>
      </div>
    </figure>
  );
}

function Checklist({ checklist, canWrite }: { checklist: LocalRecord; canWrite: boolean }) {
  const db = useSyncDb();
  const items = useLiveQuery(() => listByParent(db, "checklist-items", "checklistId", checklist.id), [db, checklist.id]);
  const [error, setError] = useState<string | null>(null);
  const order = (checklist.kind === "cold-weather" ? COLD_ITEMS : HOT_ITEMS).map(([key]) => key);
  const sorted = [...(items ?? [])].sort((a, b) => order.indexOf(str(a.itemKey)) - order.indexOf(str(b.itemKey)));
  const answer = async (item: LocalRecord, patch: Record<string, unknown>) => {
    setError(null);
    try {
      await updateLocal(db, "checklist-items", item.id, patch);
    } catch (e) {
      setError(writeErrorOf(e).message);
    }
  };
  const done = sorted.filter((i) => i.answer).length;
  return (
    <div className="mt-3 rounded-lg border border-ink-200 p-3" data-testid={`checklist-${str(checklist.kind)}`}>
      <p className="flex items-center gap-2 text-lg font-bold">
        <ClipboardCheck className="h-5 w-5" aria-hidden="true" />
        {checklist.kind === "hot-weather" ? "Hot-weather checklist" : checklist.kind === "cold-weather" ? "Cold-weather checklist" : "Readiness checklist"}
        <span className="text-sm font-normal text-muted">
          {done} of {sorted.length} answered
        </span>
      </p>
      <ul className="mt-2 flex flex-col divide-y divide-ink-100">
        {sorted.map((item) => (
          <li key={item.id} className="py-2" data-testid="checklist-item">
            <p className="font-semibold">{str(item.label)}</p>
            <div className="mt-1 grid grid-cols-3 gap-2" role="group" aria-label={str(item.label)}>
              {(["yes", "no", "na"] as const).map((a) => (
                <button
                  key={a}
                  type="button"
                  aria-pressed={item.answer === a}
                  disabled={!canWrite}
                  onClick={() => void answer(item, { answer: item.answer === a ? null : a })}
                  className={clsx(
                    "min-h-touch rounded-lg border font-semibold",
                    item.answer === a ? (a === "no" ? "border-danger-600 bg-danger-50 text-danger-800" : "border-lichen-700 bg-lichen-50 text-lichen-900") : "border-ink-300 bg-white",
                  )}
                >
                  {a === "yes" ? "Yes" : a === "no" ? "No" : "N/A"}
                </button>
              ))}
            </div>
            <input
              aria-label={`Note: ${str(item.label)}`}
              placeholder="Note"
              defaultValue={str(item.note)}
              disabled={!canWrite}
              onBlur={(e) => e.target.value !== str(item.note) && void answer(item, { note: e.target.value || null })}
              className="mt-2 min-h-touch w-full rounded-lg border border-ink-300 px-3"
            />
            <RecordPhotos projectId={checklist.projectId} recordType="checklist-items" recordId={item.id} canAdd={canWrite} />
          </li>
        ))}
      </ul>
      {error ? <Notice tone="danger" title="Not saved">{error}</Notice> : null}
    </div>
  );
}

export function WeatherWatch({ placement, project, mix }: { placement: LocalRecord; project: ProjectRow; mix: LocalRecord | null }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const lowBleed = mix?.lowBleed === true;
  const observations = useLiveQuery(async () => (await listByParent(db, "weather-observations", "placementId", placement.id)).sort(byTime("observedAt")), [db, placement.id]);
  const checklists = useLiveQuery(() => listByParent(db, "checklists", "placementId", placement.id), [db, placement.id]);
  const [adding, setAdding] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [starting, setStarting] = useState(false);
  const canObserve = mayWrite(project, "weather.write");
  const canCheck = mayWrite(project, "checklist.write");

  const rows = (observations ?? []).map((o) => ({
    o,
    evap: evaporationOf({ airTempC: num(o.airTempC), relativeHumidityPct: num(o.relativeHumidityPct), windKmh: num(o.windKmh), concreteTempC: num(o.concreteTempC) }, project, lowBleed),
  }));
  const hot = rows.some((r) => r.evap?.risk === "high");
  const cold = rows.some((r) => (num(r.o.airTempC) ?? 99) <= COLD_AIR_C);
  const has = (kind: string) => (checklists ?? []).some((c) => c.kind === kind);
  const highSI = (num(project.evaporationHighKgM2H) ?? 1.0) * (lowBleed ? 0.5 : 1);
  const points = rows.filter((r) => r.evap).map((r) => ({ time: formatTime(r.o.observedAt, project.timeZone), rate: Number(toDisplay("evaporationRate", r.evap!.rateSI, units).toFixed(2)) }));

  const start = async (kind: "hot-weather" | "cold-weather") => {
    setError(null);
    setStarting(true);
    try {
      const { id } = await createLocal(db, "checklists", placement.projectId, { placementId: placement.id, kind });
      for (const [itemKey, label] of kind === "hot-weather" ? HOT_ITEMS : COLD_ITEMS) {
        await createLocal(db, "checklist-items", placement.projectId, { checklistId: id, itemKey, label });
      }
    } catch (e) {
      setError(writeErrorOf(e).message);
    } finally {
      setStarting(false);
    }
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
      {adding ? <ObservationForm placement={placement} project={project} lowBleed={lowBleed} onDone={() => setAdding(false)} /> : null}
      {rows.length === 0 && !adding ? <p className="text-muted">No observations yet.</p> : null}
      <ul className="mt-3 flex flex-col gap-2">
        {rows.map(({ o, evap }) => (
          <li key={o.id} className="rounded-lg border border-ink-200 p-3" data-testid="weather-row">
            <p className="flex flex-wrap items-center gap-2">
              <CloudSun className="h-5 w-5 text-ink-600" aria-hidden="true" />
              <span className="font-bold">{formatTime(o.observedAt, project.timeZone)}</span>
              <span>
                air {num(o.airTempC) !== undefined ? formatTemperature(num(o.airTempC)!, units) : "—"} · {num(o.relativeHumidityPct) ?? "—"} % RH · wind{" "}
                {num(o.windKmh) !== undefined ? formatSpeed(num(o.windKmh)!, units) : "—"}
                {num(o.concreteTempC) !== undefined ? ` · concrete ${formatTemperature(num(o.concreteTempC)!, units)}` : ""}
                {o.sun ? ` · ${str(o.sun)}` : ""}
              </span>
            </p>
            {evap ? (
              <p className="mt-1 flex flex-wrap items-center gap-2">
                <span className="text-xl font-bold" data-testid="weather-rate">
                  {formatEvaporation(evap.rateSI, units)}
                </span>
                <RiskBadge risk={evap.risk} testId="weather-risk" />
              </p>
            ) : null}
            <RecordPhotos projectId={project.id} recordType="weather-observations" recordId={o.id} canAdd={canAddPhotos(project, placement)} />
          </li>
        ))}
      </ul>
      {hot ? (
        <Notice tone="danger" title="High evaporation risk" className="mt-3" testId="weather-high-risk">
          Plastic shrinkage cracking is likely: fog the air above the surface, put up windbreaks and sunshades, use an evaporation reducer and start
          curing promptly. ACI 305R: precautions when evaporation exceeds 1.0 kg/m²/h (0.2 lb/ft²/h). The project specification governs.
        </Notice>
      ) : null}
      {cold ? (
        <Notice tone="caution" title="Cold weather" className="mt-3" testId="weather-cold">
          Air at or below {formatTemperature(COLD_AIR_C, units)}: protect the concrete and keep it above the minimum for its section (ACI 306R). The
          project specification governs.
        </Notice>
      ) : null}
      {hot && canCheck && !has("hot-weather") ? (
        <Button className="mt-3" data-testid="start-hot-checklist" disabled={starting} onClick={() => void start("hot-weather")}>
          <ClipboardCheck className="h-5 w-5" aria-hidden="true" /> Start the hot-weather checklist
        </Button>
      ) : null}
      {cold && canCheck && !has("cold-weather") ? (
        <Button className="mt-3" data-testid="start-cold-checklist" disabled={starting} onClick={() => void start("cold-weather")}>
          <ClipboardCheck className="h-5 w-5" aria-hidden="true" /> Start the cold-weather checklist
        </Button>
      ) : null}
      {error ? (
        <Notice tone="danger" title="Not saved" className="mt-2">
          {error}
        </Notice>
      ) : null}
      <DayChart points={points} units={units} highSI={highSI} />
      {(checklists ?? []).map((c) => (
        <Checklist key={c.id} checklist={c} canWrite={canCheck} />
      ))}
    </Section>
  );
}
