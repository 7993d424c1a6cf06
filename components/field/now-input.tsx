"use client";

import clsx from "clsx";
import { formatInstant } from "@/lib/time/zone";
import { fromLocalInput, toLocalInput, toTimeInput } from "./project-time";

/** A datetime or time input with a big "Now" button beside it. */
export function NowInput({
  label,
  value,
  onChange,
  type = "time",
  error,
  testId,
  timeZone,
  hint,
}: {
  timeZone?: string;
  hint?: React.ReactNode;
  label: string;
  value: string;
  onChange: (value: string) => void;
  type?: "time" | "datetime-local";
  error?: string;
  testId?: string;
}) {
  const now = () => onChange(type === "time" ? toTimeInput(new Date(), timeZone) : toLocalInput(new Date(), timeZone));
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label className="text-sm font-semibold text-ink-800">
        {label}
        <div className="mt-1 flex gap-2">
          <input
            type={type}
            value={value}
            data-testid={testId}
            aria-invalid={error ? true : undefined}
            onChange={(e) => onChange(e.target.value)}
            className={clsx(
              "min-h-touch w-full min-w-0 rounded-lg border bg-white px-3 text-base font-normal text-ink-950",
              error ? "border-danger-600" : "border-ink-300",
            )}
          />
          <button
            type="button"
            onClick={now}
            data-testid={testId ? `${testId}-now` : undefined}
            className="min-h-touch shrink-0 rounded-lg border border-ink-300 bg-white px-3 text-base font-semibold text-ink-900 hover:bg-ink-50"
          >
            Now
          </button>
        </div>
      </label>
      {hint ?? (type === "datetime-local" && timeZone ? <ZoneHint value={value} timeZone={timeZone} /> : null)}
      {error ? (
        <p className="text-sm font-medium text-danger-700" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** The instant a datetime-local value names on the project's clock, with the zone's abbreviation (CDT or CST on a change night). */
function ZoneHint({ value, timeZone }: { value: string; timeZone: string }) {
  const at = fromLocalInput(value, timeZone);
  if (!at) return null;
  const text = formatInstant(at, timeZone, "weekdayDayTimeZone");
  return <p className="text-sm text-muted">{text} (project time)</p>;
}
