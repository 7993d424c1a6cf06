"use client";

import { CartesianGrid, ComposedChart, Line, ReferenceLine, Scatter, XAxis, YAxis } from "recharts";
import { formatStrength, mpaToPsi, type UnitSystem } from "@/lib/concrete";
import type { MixAcceptance } from "@/lib/checks/strength";
import { paletteHex } from "@/lib/ui/palette";

const INK_600 = paletteHex("ink-600");
const INK_200 = paletteHex("ink-200");
const LICHEN_600 = paletteHex("lichen-600");
const INK_900 = paletteHex("ink-900");
const DANGER_700 = paletteHex("danger-700");
const CAUTION_700 = paletteHex("caution-700");

const inUnits = (mpa: number, u: UnitSystem) => (u === "SI" ? Math.round(mpa * 10) / 10 : Math.round(mpaToPsi(mpa)));
const axisTick = { fill: INK_600, fontSize: 12 };
const range = (from: number, to: number, step: number) => Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

/** Each cylinder's strength against its age, the mean per age, and f′c across. */
export function StrengthAgeChart({ cylinders, fcMPa, unitSystem, title }: { cylinders: { ageDays: number; strengthMPa: number }[]; fcMPa: number | null; unitSystem: UnitSystem; title: string }) {
  const points = cylinders.map((c) => ({ age: c.ageDays, value: inUnits(c.strengthMPa, unitSystem) }));
  const ages = [...new Set(points.map((p) => p.age))].sort((a, b) => a - b);
  const means = ages.map((age) => {
    const at = points.filter((p) => p.age === age);
    return { age, mean: at.reduce((s, p) => s + p.value, 0) / at.length };
  });
  const fc = fcMPa === null ? null : inUnits(fcMPa, unitSystem);
  const top = Math.max(fc ?? 0, ...points.map((p) => p.value)) * 1.15;
  const unit = unitSystem === "SI" ? "MPa" : "psi";
  const step = unitSystem === "SI" ? 10 : 1000;
  const yTop = Math.max(step, Math.ceil(top / step) * step);
  return (
    <figure className="m-0" data-testid="strength-age-chart">
      <figcaption className="text-sm font-semibold">{title}</figcaption>
      <div aria-hidden="true" className="h-56 w-full">
        <ComposedChart responsive style={{ width: "100%", height: "100%" }} margin={{ top: 8, right: 12, bottom: 18, left: 4 }} accessibilityLayer={false}>
          <CartesianGrid stroke={INK_200} strokeDasharray="3 3" />
          <XAxis dataKey="age" type="number" domain={[0, Math.max(28, ...ages) + 2]} ticks={[0, 7, 14, 28, ...ages.filter((a) => a > 28)]} stroke={INK_600} tick={axisTick}
            label={{ value: "Age (days)", position: "insideBottom", offset: -12, fill: INK_600, fontSize: 12 }} />
          <YAxis type="number" domain={[0, yTop]} ticks={range(0, yTop, step)} width={48} stroke={INK_600} tick={axisTick} />
          {fc !== null ? <ReferenceLine y={fc} stroke={INK_900} strokeDasharray="6 4" label={{ value: `f′c ${fc} ${unit}`, position: "insideBottomRight", fill: INK_900, fontSize: 12 }} /> : null}
          <Line data={means} dataKey="mean" type="linear" stroke={LICHEN_600} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Scatter data={points} dataKey="value" fill={LICHEN_600} isAnimationActive={false} />
        </ComposedChart>
      </div>
      <p className="sr-only">{points.map((p) => `${p.value} ${unit} at ${p.age} days`).join("; ")}</p>
    </figure>
  );
}

/** Strength tests in sampling order, the running average of three, f′c and the individual limit. */
export function RunningAverageChart({ acceptance }: { acceptance: MixAcceptance }) {
  const u = acceptance.unitSystem;
  const data = acceptance.tests.map((t, i) => ({
    n: i + 1,
    set: t.setCode,
    test: inUnits(t.averageMPa, u),
    running: t.runningAverageMPa === null ? null : inUnits(t.runningAverageMPa, u),
  }));
  const fc = inUnits(acceptance.mix.fcMPa, u);
  const limit = inUnits(acceptance.individualLimitMPa, u);
  const values = data.flatMap((d) => [d.test, d.running ?? d.test]);
  const step = u === "SI" ? 5 : 500;
  const bottom = Math.floor((Math.min(limit, ...values) * 0.9) / step) * step;
  const top = Math.ceil((Math.max(fc, ...values) * 1.08) / step) * step;
  return (
    <figure className="m-0" data-testid="running-average-chart">
      <figcaption className="text-sm font-semibold">Strength tests and the running average of three against f′c ({acceptance.mix.code})</figcaption>
      <div aria-hidden="true" className="h-56 w-full">
        <ComposedChart responsive style={{ width: "100%", height: "100%" }} data={data} margin={{ top: 10, right: 16, bottom: 18, left: 4 }} accessibilityLayer={false}>
          <CartesianGrid stroke={INK_200} strokeDasharray="3 3" vertical={false} />
          <XAxis dataKey="n" type="number" domain={[0.5, Math.max(3, data.length) + 0.5]} ticks={data.map((d) => d.n)} tickFormatter={(n: number) => data[n - 1]?.set ?? ""} stroke={INK_600} tick={axisTick} />
          <YAxis type="number" domain={[bottom, top]} ticks={range(bottom, top, step)} width={52} stroke={INK_600} tick={axisTick} />
          <ReferenceLine y={fc} stroke={INK_900} strokeWidth={2} label={{ value: `f′c ${formatStrength(acceptance.mix.fcMPa, u)}`, position: "insideTopLeft", fill: INK_900, fontSize: 12 }} />
          <ReferenceLine y={limit} stroke={DANGER_700} strokeDasharray="6 4" label={{ value: `Lowest single test ${formatStrength(acceptance.individualLimitMPa, u)}`, position: "insideBottomLeft", fill: DANGER_700, fontSize: 12 }} />
          <Scatter dataKey="test" fill={CAUTION_700} isAnimationActive={false} name="Strength test" />
          <Line dataKey="running" type="linear" stroke={LICHEN_600} strokeWidth={3} dot={{ r: 5, fill: LICHEN_600, stroke: "#ffffff", strokeWidth: 2 }} connectNulls={false} isAnimationActive={false} name="Average of three" />
        </ComposedChart>
      </div>
      <p className="text-xs text-muted">Brown dots: strength tests (average of a sample&apos;s cylinders at {acceptance.mix.fcAgeDays} days). Green line and dots: average of three consecutive tests. Solid line: f′c. Dashed: lowest permitted single test.</p>
    </figure>
  );
}
