"use client";
// The recharts drawing of the calculator's chart, in its own module so recharts (about 115 KB
// gzipped) loads only when the chart comes near the screen (rate-chart.tsx). The figure's title and
// its summary in words stay in rate-chart.tsx and render with the page.
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, XAxis, YAxis } from "recharts";
import { formatRate } from "./evaporation-model";
import type { ChartPoint } from "./evaporation-chart-model";
import { paletteHex } from "@/lib/ui/palette";

// Palette values from tailwind.config.ts: SVG strokes need literal colours.
const INK_900 = paletteHex("ink-900");
const INK_600 = paletteHex("ink-600");
const INK_200 = paletteHex("ink-200");
const LICHEN_600 = paletteHex("lichen-600");
const CAUTION_700 = paletteHex("caution-700");
const DANGER_700 = paletteHex("danger-700");

export type RatePlotProps = {
  points: ChartPoint[];
  currentWind: number;
  currentRate: number;
  cautionAt: number;
  highAt: number;
  xTop: number;
  xTicks: number[];
  yTop: number;
  yTicks: number[];
  speedUnit: string;
};

export default function RatePlot({ points, currentWind, currentRate, cautionAt, highAt, xTop, xTicks, yTop, yTicks, speedUnit }: RatePlotProps) {
  return (
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
  );
}
