"use client";

import dynamic from "next/dynamic";
import { Notice } from "@/components/ui/notice";
import { WhenVisible } from "@/components/ui/when-visible";
import { formatStrength, fromDisplay, toDisplay, unitLabel, type UnitSystem } from "@/lib/concrete";
import { CalibrationPoints } from "./calibration-points";
import { MATURITY_CAUTIONS, chartSeries, estimateText, targetText, type MaturityView } from "@/lib/maturity/view";

// recharts is heavy: the chart loads in the browser only, when it comes near the screen.
const chartPlaceholder = <div className="h-64 w-full animate-pulse rounded-lg bg-ink-50" aria-hidden="true" />;
const MaturityChart = dynamic(() => import("./maturity-chart").then((m) => m.MaturityChart), {
  ssr: false,
  loading: () => chartPlaceholder,
});

/** The estimate now, the time to the target, the chart, the findings and the cautions: field and office alike. */
export function MaturitySummary({
  view,
  units,
  timeZone,
  targetText: typedTarget,
  onTargetChange,
}: {
  view: MaturityView;
  units: UnitSystem;
  timeZone: string;
  targetText: string;
  onTargetChange: (text: string) => void;
}) {
  const { assessment, calibration } = view;
  const coldest = assessment.coldest;
  return (
    <div className="flex flex-col gap-3" data-testid="maturity-summary">
      <div className="grid gap-x-4 gap-y-2 sm:grid-cols-2">
        <dl>
          <dt className="text-sm text-muted">Estimated strength now{coldest ? ` (coldest: ${coldest.name})` : ""}</dt>
          <dd className="text-xl font-bold text-ink-950" data-testid="maturity-estimate">{estimateText(view, units)}</dd>
          {coldest && coldest.maturity !== null ? (
            <dd className="text-sm text-muted" data-testid="maturity-index">
              Maturity {Math.round(coldest.maturity).toLocaleString("en-US")} {view.unit} at its last reading
            </dd>
          ) : null}
        </dl>
        <div>
          <label className="text-sm text-muted" htmlFor="maturity-target">
            Target strength ({unitLabel("strength", units)})
          </label>
          <input
            id="maturity-target"
            inputMode="decimal"
            className="mt-1 block w-32 rounded-md border border-ink-300 px-2 py-1 text-lg"
            value={typedTarget}
            onChange={(e) => onTargetChange(e.target.value)}
            data-testid="maturity-target-input"
          />
          <p className="mt-1 font-semibold text-ink-950" data-testid="maturity-target">{targetText(view, timeZone)}</p>
        </div>
      </div>
      {calibration?.ok ? (
        <p className="text-sm text-muted" data-testid="maturity-calibration">
          Calibration: {new Set(calibration.points.map((p) => p.ageDays)).size} ages up to {formatStrength(calibration.maxStrengthMPa, units)}, S = {calibration.fit.a.toFixed(1)} + {calibration.fit.b.toFixed(2)}·log₁₀(M) in MPa,
          R² = {calibration.fit.rSquared.toFixed(3)}; {view.settings.method === "nurse-saul" ? `Nurse-Saul, datum ${view.settings.datumC} °C` : `equivalent age at ${view.settings.referenceC} °C, E = ${(view.settings.activationEnergyJPerMol / 1000).toFixed(1)} kJ/mol`}.
        </p>
      ) : null}
      {calibration ? <CalibrationPoints points={calibration.points} unit={view.unit} units={units} /> : null}
      <WhenVisible placeholder={chartPlaceholder} testId="maturity-chart-box">
        <MaturityChart series={chartSeries(view)} unit={view.unit} units={units} timeZone={timeZone} />
      </WhenVisible>
      {view.findings.length > 0 ? (
        <ul className="flex flex-col gap-2" data-testid="maturity-findings">
          {view.findings.map((f) => (
            <li key={`${f.rule}:${f.subject.id}:${f.at}`}>
              <Notice tone={f.severity === "warning" ? "danger" : f.severity === "caution" ? "caution" : "info"} title={f.title}>
                {f.message}
              </Notice>
            </li>
          ))}
        </ul>
      ) : null}
      <Notice tone="caution" title="Before stripping, stressing or loading" testId="maturity-cautions">
        <ul className="list-disc pl-5">
          {MATURITY_CAUTIONS.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </Notice>
    </div>
  );
}

/** The target typed in the project's units → MPa (null when empty or not a number). */
export function targetMPaOf(text: string, units: UnitSystem): number | null {
  const v = Number(text.trim().replace(",", "."));
  return text.trim() === "" || !Number.isFinite(v) || v <= 0 ? null : fromDisplay("strength", v, units);
}

/** The project's target in its units, as the input's first text. */
export function targetInputOf(targetMPa: unknown, units: UnitSystem): string {
  if (typeof targetMPa !== "number") return "";
  const v = toDisplay("strength", targetMPa, units);
  return units === "SI" ? String(Math.round(v * 10) / 10) : String(Math.round(v));
}
