"use client";

import clsx from "clsx";
import { ChevronDown, CircleAlert, CircleCheck, OctagonAlert } from "lucide-react";
import { unitLabel, type EvaporationDescription, type EvaporationRisk, type UnitSystem } from "@/lib/concrete";
import { formatRate, riskThresholds } from "./evaporation-model";

// Each level has its word, its icon and its colour: never colour alone.
const RISK: Record<EvaporationRisk, { word: string; meaning: string; icon: typeof CircleCheck; box: string; badge: string }> =
  {
    low: {
      word: "Low",
      meaning: "Below the caution level: normal finishing and curing.",
      icon: CircleCheck,
      box: "border-lichen-600 bg-lichen-50",
      badge: "bg-lichen-700 text-white",
    },
    caution: {
      word: "Caution",
      meaning: "Getting close to the rate at which plastic shrinkage cracks form: have precautions ready.",
      icon: CircleAlert,
      box: "border-caution-600 bg-caution-50",
      badge: "bg-caution-700 text-white",
    },
    high: {
      word: "High",
      meaning: "At or above the rate at which precautions are needed: plastic shrinkage cracks are likely.",
      icon: OctagonAlert,
      box: "border-danger-600 bg-danger-50",
      badge: "bg-danger-700 text-white",
    },
  };

/** The rate in large type, the risk level in words, icon and colour, and the rule behind it. */
export function EvaporationResult({
  description,
  lowBleed,
  stale,
}: {
  description: EvaporationDescription;
  lowBleed: boolean;
  /** True while a field holds something that cannot be used: the last good result stays up. */
  stale: boolean;
}) {
  const { rate, risk, unitSystem } = description;
  const level = RISK[risk];
  const Icon = level.icon;
  return (
    <section
      id="evap-result"
      aria-labelledby="evap-result-title"
      className={clsx("scroll-mt-4 rounded-xl border-2 p-4 sm:p-5", level.box)}
    >
      <h2 id="evap-result-title" className="text-sm font-semibold uppercase tracking-wide text-ink-700">
        Evaporation rate
      </h2>
      <div aria-live="polite" aria-atomic="true">
        <p className="mt-1 flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <span data-testid="evap-rate" className="font-mono text-6xl font-bold tabular-nums text-ink-950 sm:text-7xl">
            {formatRate(rate)}
          </span>
          <span className="text-xl font-semibold text-ink-800">{unitLabel("evaporationRate", unitSystem)}</span>
        </p>
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <span className={clsx("inline-flex items-center gap-2 rounded-lg px-3 py-2 text-xl font-bold", level.badge)}>
            <Icon className="h-6 w-6" aria-hidden="true" />
            <span>
              <span data-testid="evap-risk">{level.word}</span>
              <span className="sr-only"> risk</span>
            </span>
          </span>
          <span className="text-base font-semibold text-ink-900">risk of plastic shrinkage cracking</span>
        </div>
        <p className="mt-2 text-base text-ink-900">{level.meaning}</p>
      </div>
      {stale ? (
        <p className="mt-3 flex items-start gap-2 rounded-lg border border-ink-300 bg-white p-2 text-sm font-semibold text-ink-900">
          <CircleAlert className="mt-0.5 h-4 w-4 shrink-0" aria-hidden="true" />
          This is the result for the last complete entry. Correct the marked field to update it.
        </p>
      ) : null}
      <RuleNote unitSystem={unitSystem} lowBleed={lowBleed} rule={description.rule} />
    </section>
  );
}

function RuleNote({ unitSystem, lowBleed, rule }: { unitSystem: UnitSystem; lowBleed: boolean; rule: string }) {
  const { cautionAt, highAt } = riskThresholds(unitSystem, lowBleed);
  const unit = unitLabel("evaporationRate", unitSystem);
  const published = riskThresholds(unitSystem, false).highAt;
  return (
    <div className="mt-4 border-t border-ink-300/70 pt-3 text-sm text-ink-800">
      <p>
        <span className="font-semibold text-ink-900">Rule: </span>
        {rule}. Levels used here: high from {formatRate(highAt)} {unit}
        {lowBleed ? ` (half the ACI 305R ${formatRate(published)}, for a low-bleed mix: Silica Fume Association guidance)` : " (ACI 305R Fig. 2.1.5)"}, caution from{" "}
        {formatRate(cautionAt)} {unit} (our band). The project specification, local codes and the engineer of record govern over these defaults.
      </p>
      <p className="mt-1">
        <span className="font-semibold text-ink-900">Formula: </span>
        Uno (ACI Materials Journal, 1998), the ACI 305R / 308R nomograph in one line.
      </p>
    </div>
  );
}

/** Phone only: the rate and level stay in sight at the foot of the inputs while they are edited. */
export function ResultStrip({ description, className }: { description: EvaporationDescription; className?: string }) {
  const level = RISK[description.risk];
  const Icon = level.icon;
  return (
    <a
      href="#evap-result"
      className={clsx(
        "flex min-h-touch items-center gap-3 rounded-lg bg-ink-900 px-3 py-2 text-white shadow-lg",
        "focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-lichen-600",
        className,
      )}
    >
      <span className="font-mono text-2xl font-bold tabular-nums">{formatRate(description.rate)}</span>
      <span className="text-sm font-semibold text-ink-100">{unitLabel("evaporationRate", description.unitSystem)}</span>
      <span className={clsx("ml-auto inline-flex items-center gap-1.5 rounded-md px-2 py-1 font-bold", level.badge)}>
        <Icon className="h-5 w-5" aria-hidden="true" />
        {level.word}
        <span className="sr-only"> risk: see the details</span>
      </span>
      <ChevronDown className="h-5 w-5 shrink-0 text-ink-200" aria-hidden="true" />
    </a>
  );
}
