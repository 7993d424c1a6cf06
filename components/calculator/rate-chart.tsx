"use client";

import { useId } from "react";
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, XAxis, YAxis } from "recharts";
import { unitLabel, type UnitSystem } from "@/lib/concrete";
import { chartSummary, type ChartPoint } from "./evaporation-chart-model";
import { formatRate, riskThresholds } from "./evaporation-model";
import { paletteHex } from "@/lib/ui/palette";

// Palette values from tailwind.config.ts: SVG strokes need literal colours.
const INK_900 = paletteHex("ink-900");
const INK_600 = paletteHex("ink-600");
const INK_200 = paletteHex("ink-200");
const LICHEN_600 = paletteHex("lichen-600");
const CAUTION_700 = paletteHex("caution-700");
const DANGER_700 = paletteHex("danger-700");

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
        <LineChart
          responsive
          style={{ width: "100%", height: "100%" }}
          data={points}
          margin={{ top: 12, right: 16, bottom: 22, left: 4 }}
          accessibilityLayer={false}
        >
          <CartesianGrid stroke={INK_200} strokeDasharray="3 3" vertical={false} />
          <XAxis
            dataKey="wind"
            type="number"
            domain={[0, xTop]}
            ticks={xTicks}
            stroke={INK_600}
            tick={{ fill: INK_600, fontSize: 12 }}
            label={{ value: `Wind (${speedUnit})`, position: "insideBottom", offset: -14, fill: INK_600, fontSize: 12 }}
          />
          <YAxis
            type="number"
            domain={[0, yTop]}
            ticks={yTicks}
            width={44}
            stroke={INK_600}
            tick={{ fill: INK_600, fontSize: 12 }}
            tickFormatter={(value: number) => value.toFixed(2)}
          />
          <ReferenceLine
            y={highAt}
            stroke={DANGER_700}
            strokeWidth={2}
            strokeDasharray="6 4"
            label={{ value: `High ${formatRate(highAt)}`, position: "insideTopRight", fill: DANGER_700, fontSize: 12 }}
          />
          <ReferenceLine
            y={cautionAt}
            stroke={CAUTION_700}
            strokeWidth={2}
            strokeDasharray="2 4"
            label={{
              value: `Caution ${formatRate(cautionAt)}`,
              position: "insideTopRight",
              fill: CAUTION_700,
              fontSize: 12,
            }}
          />
          <Line
            type="linear"
            dataKey="rate"
            stroke={LICHEN_600}
            strokeWidth={3}
            dot={false}
            isAnimationActive={false}
          />
          <ReferenceDot
            x={Math.min(currentWind, xTop)}
            y={currentRate}
            r={7}
            fill={INK_900}
            stroke="#ffffff"
            strokeWidth={2}
            ifOverflow="extendDomain"
          />
        </LineChart>
      </div>
      <figcaption id={summaryId} className="mt-1 text-sm text-ink-800">
        {chartSummary(points, unitSystem, lowBleed)}
      </figcaption>
    </figure>
  );
}
