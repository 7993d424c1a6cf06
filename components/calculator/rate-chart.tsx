"use client";

import { useId } from "react";
import dynamic from "next/dynamic";
import { unitLabel, type UnitSystem } from "@/lib/concrete";
import { chartSummary, type ChartPoint } from "./evaporation-chart-model";
import { riskThresholds } from "./evaporation-model";
import { WhenVisible } from "@/components/ui/when-visible";

// recharts loads when the chart comes near the screen (below the form on a phone); the box below
// keeps the drawing's height meanwhile, so nothing moves when it arrives.
const RatePlot = dynamic(() => import("./rate-plot"), { ssr: false });

// Evenly spaced round ticks from 0 past `top`: multiples of `unit`, at most seven of them.
function roundTicks(top: number, unit: number): number[] {
  let step = unit;
  while (Math.ceil(top / step - 1e-9) > 6) step *= 2;
  const count = Math.max(1, Math.ceil(top / step - 1e-9));
  return Array.from({ length: count + 1 }, (_, i) => Math.round(i * step * 1e6) / 1e6);
}

/** Rate against wind speed for the current temperatures, with the two risk levels drawn across. */
export function RateChart({
  points,
  currentWind,
  currentRate,
  unitSystem,
  lowBleed,
}: {
  points: ChartPoint[];
  currentWind: number;
  currentRate: number;
  unitSystem: UnitSystem;
  lowBleed: boolean;
}) {
  const titleId = useId();
  const summaryId = useId();
  const { cautionAt, highAt } = riskThresholds(unitSystem, lowBleed);
  const rateUnit = unitLabel("evaporationRate", unitSystem);
  const speedUnit = unitLabel("speed", unitSystem);
  const peak = Math.max(highAt * 1.3, ...points.map((p) => p.rate), currentRate);
  const yTicks = roundTicks(peak * 1.05, unitSystem === "SI" ? 0.25 : 0.05);
  const yTop = yTicks[yTicks.length - 1];
  const xTop = points[points.length - 1]?.wind ?? 0;
  const xTicks = roundTicks(xTop, unitSystem === "SI" ? 10 : 5).filter((tick) => tick <= xTop);

  return (
    <figure data-testid="evap-chart" aria-labelledby={titleId} aria-describedby={summaryId} className="m-0">
      <p id={titleId} className="text-base font-semibold text-ink-900">
        Rate ({rateUnit}) against wind speed
      </p>
      <p className="text-sm text-muted">
        For the temperatures and humidity entered; the dot is the wind you entered.
      </p>
      {/* The summary below says everything the drawing shows, so the drawing is hidden from screen readers. */}
      <div aria-hidden="true" className="mt-2 h-56 w-full sm:h-64">
        <WhenVisible placeholder={null} className="h-full w-full">
          <RatePlot
            points={points}
            currentWind={currentWind}
            currentRate={currentRate}
            cautionAt={cautionAt}
            highAt={highAt}
            xTop={xTop}
            xTicks={xTicks}
            yTop={yTop}
            yTicks={yTicks}
            speedUnit={speedUnit}
          />
        </WhenVisible>
      </div>
      <figcaption id={summaryId} className="mt-1 text-sm text-ink-800">
        {chartSummary(points, unitSystem, lowBleed)}
      </figcaption>
    </figure>
  );
}
