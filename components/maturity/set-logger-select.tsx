"use client";

import { curingBasisLabel } from "@/lib/ui/vocabulary";

/**
 * How a specimen set is cured: a temperature sensor of its placement cured with it (its record
 * gives the calibration's maturities) or standard curing. Only sensors of the set's placement are offered.
 */
export function SetLoggerSelect({
  sensors,
  error,
  testId,
  ...field
}: { sensors: ({ id: string } & Record<string, unknown>)[]; error?: string; testId?: string } & React.ComponentPropsWithRef<"select">) {
  return (
    <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
      Curing
      <select
        data-testid={testId}
        aria-invalid={error ? true : undefined}
        className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal"
        {...field}
      >
        <option value="">{curingBasisLabel(null)}</option>
        {sensors.map((s) => (
          <option key={s.id} value={s.id}>
            {curingBasisLabel(String(s.name))}
          </option>
        ))}
      </select>
      {sensors.length === 0 ? <span className="text-xs font-normal text-muted">No temperature sensor on this placement yet.</span> : null}
      {error ? <span className="text-sm font-normal text-danger-700">{error}</span> : null}
    </label>
  );
}
