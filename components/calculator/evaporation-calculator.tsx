"use client";

import clsx from "clsx";
import { Scale } from "lucide-react";
import { useState } from "react";
import type { UnitSystem } from "@/lib/concrete";
import { EvaporationGuidance } from "./evaporation-guidance";
import { RateChart } from "./rate-chart";
import {
  DEFAULT_DRAFTS,
  isExample,
  FIELD_LABELS,
  FIELD_NAMES,
  evaluate,
  fieldUnit,
  convertDraft,
  weatherCautions,
  type Draft,
  type FieldName,
} from "./evaporation-model";
import { rateByWind } from "./evaporation-chart-model";
import { EvaporationResult, ResultStrip } from "./evaporation-result";
import { MeasureField } from "./measure-field";
// recharts loads after the first paint (the result and guidance above it do not need it); the
// placeholder keeps the chart's height so nothing moves when it arrives.
import { useHydrated, useUnitSystem } from "./use-unit-system";

/** A draft and the unit system it was typed in; shown converted when the user switches systems. */
type Entry = { system: UnitSystem; draft: Draft };

const UNIT_CHOICES: { value: UnitSystem; label: string }[] = [
  { value: "IP", label: "Inch-pound (°F, mph)" },
  { value: "SI", label: "SI (°C, km/h)" },
];

const HINTS: Partial<Record<FieldName, string>> = {
  wind: "Average, not gusts, about 0.5 m (20 in) above the surface",
  concreteTemp: "Fresh concrete as placed",
};

// Everything is computed in the browser from lib/concrete: no server round-trip, so it works offline.
export function EvaporationCalculator() {
  const hydrated = useHydrated();
  const [unitSystem, setUnitSystem] = useUnitSystem();
  const [lowBleed, setLowBleed] = useState(false);
  const [entry, setEntry] = useState<Entry>({ system: "IP", draft: DEFAULT_DRAFTS.IP });
  // The last entry that could be computed: its result stays up while a field is being corrected.
  const [lastGood, setLastGood] = useState<Entry>(entry);

  const draft = convertDraft(entry.draft, entry.system, unitSystem);
  const current = evaluate(draft, unitSystem, lowBleed);
  const goodDraft = convertDraft(lastGood.draft, lastGood.system, unitSystem);
  const goodEval = evaluate(goodDraft, unitSystem, lowBleed);
  const shown = goodEval.ok ? goodEval : evaluate(DEFAULT_DRAFTS[unitSystem], unitSystem, lowBleed);
  if (!shown.ok) throw new Error("The example values must always compute");
  const errors = current.ok ? {} : current.errors;

  const change = (field: FieldName, value: string) => {
    const next = { ...draft, [field]: value };
    setEntry({ system: unitSystem, draft: next });
    if (evaluate(next, unitSystem, lowBleed).ok) setLastGood({ system: unitSystem, draft: next });
  };

  return (
    <div
      data-testid="evap-calculator"
      data-hydrated={hydrated ? "true" : "false"}
      className="grid gap-5 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)] lg:items-start lg:gap-8"
    >
      <form
        aria-label="Conditions"
        onSubmit={(event) => event.preventDefault()}
        className="card flex flex-col gap-5 p-4 sm:p-5 lg:sticky lg:top-4"
      >
        <fieldset>
          <legend className="mb-1.5 flex items-center gap-2 text-base font-semibold text-ink-900">
            <Scale className="h-4 w-4 text-ink-600" aria-hidden="true" />
            Units
          </legend>
          <div className="grid grid-cols-2 gap-1 rounded-lg border-2 border-ink-300 bg-ink-50 p-1">
            {UNIT_CHOICES.map(({ value, label }) => (
              <label
                key={value}
                className={clsx(
                  "relative flex min-h-12 cursor-pointer items-center justify-center rounded-md px-2 text-center text-sm font-semibold sm:text-base",
                  "has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-1 has-[:focus-visible]:outline-lichen-600",
                  unitSystem === value ? "bg-ink-900 text-white" : "text-ink-800 hover:bg-white",
                )}
              >
                <input
                  type="radio"
                  name="units"
                  value={value}
                  checked={unitSystem === value}
                  onChange={() => setUnitSystem(value)}
                  className="absolute inset-0 h-full w-full cursor-pointer appearance-none rounded-md opacity-0"
                />
                {label}
              </label>
            ))}
          </div>
        </fieldset>

        {isExample(draft, unitSystem) ? (
          <p className="rounded-lg border-2 border-ink-300 bg-ink-50 p-3 text-base text-ink-900" data-testid="evap-example-note">
            <strong>Example readings</strong> of a hot, windy afternoon, to show how the rate is read. Type your own site&apos;s readings over them.
          </p>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-1">
          {FIELD_NAMES.map((field) => (
            <MeasureField
              key={field}
              id={`evap-${field}`}
              label={FIELD_LABELS[field]}
              unit={fieldUnit(field, unitSystem)}
              value={draft[field]}
              error={errors[field]}
              hint={HINTS[field]}
              allowNegative={field === "airTemp"}
              onChange={(value) => change(field, value)}
            />
          ))}
        </div>

        <label className="flex min-h-touch cursor-pointer items-start gap-3 rounded-lg border-2 border-ink-300 bg-white p-3 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-lichen-600">
          <input
            type="checkbox"
            checked={lowBleed}
            onChange={(event) => setLowBleed(event.target.checked)}
            className="mt-0.5 h-6 w-6 shrink-0 accent-lichen-700"
          />
          <span>
            <span className="block text-base font-semibold text-ink-900">Low-bleed mix (silica fume or low w/cm)</span>
            <span className="block text-sm text-muted">Such mixes crack at about half the rate: halves both levels.</span>
          </span>
        </label>

        <ResultStrip description={shown.description} className="sticky bottom-3 z-10 -mx-1 lg:hidden" />
      </form>

      <div className="flex flex-col gap-4">
        <EvaporationResult description={shown.description} lowBleed={lowBleed} stale={!current.ok} />
        <div className="card p-4">
          <RateChart
            points={rateByWind(shown.readings, unitSystem)}
            currentWind={shown.readings.wind}
            currentRate={shown.description.rate}
            unitSystem={unitSystem}
            lowBleed={lowBleed}
          />
        </div>
        <EvaporationGuidance description={shown.description} cautions={weatherCautions(shown.readings, unitSystem, lowBleed)} />
      </div>
    </div>
  );
}
