"use client";
// The recharts plot of the weather watch's day chart, in its own module so recharts (about a
// quarter of a field page's script) loads only when a chart is on screen (next/dynamic in
// weather-watch.tsx). The service worker precaches the chunk, so it also opens offline.
import { CartesianGrid, Line, LineChart, ReferenceLine, XAxis, YAxis } from "recharts";

export default function DayChartPlot({ points, top, high }: { points: { time: string; rate: number }[]; top: number; high: number }) {
  return (
    <LineChart responsive data={points} margin={{ top: 8, right: 12, bottom: 4, left: 0 }} style={{ width: "100%", height: "100%" }}>
      <CartesianGrid stroke="#cdd5de" strokeDasharray="3 3" />
      <XAxis dataKey="time" stroke="#445466" fontSize={12} />
      <YAxis domain={[0, top]} stroke="#445466" fontSize={12} width={48} />
      <ReferenceLine y={high} stroke="#951c15" strokeDasharray="6 3" label={{ value: `precautions ${high}`, fill: "#951c15", fontSize: 12, position: "insideTopRight" }} />
      <Line type="monotone" dataKey="rate" stroke="#187467" strokeWidth={3} dot={{ r: 4 }} isAnimationActive={false} />
    </LineChart>
  );
}
