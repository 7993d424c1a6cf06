"use client";

import { CartesianGrid, Legend, Line, LineChart, XAxis, YAxis } from "recharts";
import { toDisplay, unitLabel, type UnitSystem } from "@/lib/concrete";
import { paletteHex } from "@/lib/ui/palette";
import { instantFormatter } from "@/lib/time/zone";

const INK_600 = paletteHex("ink-600");
const INK_200 = paletteHex("ink-200");
// One colour and one dash pattern per sensor, so the lines differ without relying on colour alone.
const LINES = [
  { stroke: paletteHex("lichen-600"), dash: undefined },
  { stroke: paletteHex("ink-900"), dash: "6 3" },
  { stroke: paletteHex("caution-700"), dash: "2 3" },
  { stroke: paletteHex("ink-500"), dash: "10 4" },
];
const axisTick = { fill: INK_600, fontSize: 12 };

type Series = { id: string; name: string; points: { t: number; tempC: number; maturity: number }[] };

/** Temperature (top) and maturity (bottom) of each sensor against time. */
export function MaturityChart({ series, unit, units, timeZone }: { series: Series[]; unit: string; units: UnitSystem; timeZone: string }) {
  const drawn = series.filter((s) => s.points.length > 0);
  if (drawn.length === 0) return <p className="text-sm text-muted" data-testid="maturity-chart-empty">The chart appears when a sensor has readings.</p>;
  const day = instantFormatter(timeZone, "dayHour");
  const all = drawn.flatMap((s) => s.points.map((p) => p.t));
  const domain = [Math.min(...all), Math.max(...all)];
  const rows = (key: "tempC" | "maturity") =>
    drawn.map((s) => s.points.map((p) => ({ t: p.t, v: key === "tempC" ? Math.round(toDisplay("temperature", p.tempC, units) * 10) / 10 : Math.round(p.maturity) })));
  const panel = (key: "tempC" | "maturity", label: string) => (
    <div aria-hidden="true" className="h-48 w-full">
      <LineChart responsive style={{ width: "100%", height: "100%" }} margin={{ top: 8, right: 12, bottom: 4, left: 4 }} accessibilityLayer={false}>
        <CartesianGrid stroke={INK_200} strokeDasharray="3 3" />
        <XAxis dataKey="t" type="number" domain={domain} scale="time" tickCount={5} tickFormatter={(t: number) => day.format(new Date(t))} stroke={INK_600} tick={axisTick} allowDuplicatedCategory={false} />
        <YAxis type="number" width={56} stroke={INK_600} tick={axisTick} label={{ value: label, angle: -90, position: "insideLeft", fill: INK_600, fontSize: 12, dx: 4 }} />
        {key === "tempC" ? <Legend verticalAlign="top" height={24} /> : null}
        {rows(key).map((data, i) => (
          <Line key={drawn[i].id} data={data} dataKey="v" name={drawn[i].name} type="linear" stroke={LINES[i % LINES.length].stroke} strokeDasharray={LINES[i % LINES.length].dash} strokeWidth={2} dot={false} isAnimationActive={false} />
        ))}
      </LineChart>
    </div>
  );
  return (
    <figure className="m-0" data-testid="maturity-chart">
      <figcaption className="text-sm font-semibold">Temperature and maturity per sensor</figcaption>
      {panel("tempC", unitLabel("temperature", units))}
      {panel("maturity", unit)}
      <p className="sr-only">
        {drawn.map((s) => `${s.name}: ${s.points.length} readings, maturity ${Math.round(s.points[s.points.length - 1].maturity)} ${unit}`).join("; ")}
      </p>
    </figure>
  );
}
