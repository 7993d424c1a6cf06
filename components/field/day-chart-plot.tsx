"use client";
// The recharts plot of the weather watch's day chart, in its own module so recharts (about a
// quarter of a field page's script) loads only when a chart is on screen (next/dynamic in
// weather-watch.tsx). The service worker precaches the chunk, so it also opens offline.
import { CartesianGrid, Line, LineChart, ReferenceLine, XAxis, YAxis } from "recharts";
import { paletteHex } from "@/lib/ui/palette";

export default function DayChartPlot({ points, top, high }: { points: { time: string; rate: number }[]; top: number; high: number }) {
  return (
    <LineChart responsive data={points} margin={{ top: 8, right: 12, bottom: 4, left: 0 }} style={{ width: "100%", height: "100%" }}>
      <CartesianGrid stroke={paletteHex("ink-200")} strokeDasharray="3 3" />
      <XAxis dataKey="time" stroke={paletteHex("ink-600")} fontSize={12} />
      <YAxis domain={[0, top]} stroke={paletteHex("ink-600")} fontSize={12} width={48} />
      <ReferenceLine y={high} stroke={paletteHex("danger-700")} strokeDasharray="6 3" label={{ value: `precautions ${high}`, fill: paletteHex("danger-700"), fontSize: 12, position: "insideTopRight" }} />
      <Line type="monotone" dataKey="rate" stroke={paletteHex("lichen-600")} strokeWidth={3} dot={{ r: 4 }} isAnimationActive={false} />
    </LineChart>
  );
}
