"use client";

import clsx from "clsx";
import { CircleAlert } from "lucide-react";

/**
 * A large numeric input with its unit beside it, for gloved thumbs. `allowNegative` adds a ± key,
 * because the decimal keypad on many phones has no minus sign.
 */
export function MeasureField({
  id,
  label,
  unit,
  value,
  error,
  hint,
  allowNegative,
  onChange,
}: {
  id: string;
  label: string;
  unit: string;
  value: string;
  error?: string;
  hint?: string;
  allowNegative?: boolean;
  onChange: (value: string) => void;
}) {
  const messageId = `${id}-${error ? "error" : "hint"}`;
  const flipSign = () => {
    const trimmed = value.trim();
    onChange(trimmed.startsWith("-") || trimmed.startsWith("\u2212") ? trimmed.slice(1) : `-${trimmed}`);
  };
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-base font-semibold text-ink-900">
        {label}
      </label>
      <div className="flex items-stretch gap-2">
        <div className="flex min-w-0 flex-1 items-stretch">
          <input
            id={id}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            enterKeyHint="next"
            value={value}
            onChange={(event) => onChange(event.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error || hint ? messageId : undefined}
            className={clsx(
              "min-h-14 w-full min-w-0 rounded-l-lg border-2 bg-white px-3 font-mono text-2xl font-semibold tabular-nums text-ink-950",
              "focus:outline-3 focus:outline-offset-1 focus:outline-lichen-600",
              error ? "border-danger-600" : "border-ink-300",
            )}
          />
          <span
            className={clsx(
              "inline-flex min-w-16 items-center justify-center rounded-r-lg border-2 border-l-0 bg-ink-100 px-3 text-lg font-semibold text-ink-800",
              error ? "border-danger-600" : "border-ink-300",
            )}
          >
            {unit}
          </span>
        </div>
        {allowNegative ? (
          <button
            type="button"
            onClick={flipSign}
            title={`Make the ${label.toLowerCase()} negative or positive`}
            className="inline-flex min-h-14 min-w-14 items-center justify-center rounded-lg border-2 border-ink-300 bg-white text-2xl font-semibold text-ink-800 hover:bg-ink-50 focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-lichen-600"
          >
            <span aria-hidden="true">±</span>
            <span className="sr-only">Change sign</span>
          </button>
        ) : null}
      </div>
      {error ? (
        <p id={messageId} role="alert" className="flex items-start gap-1.5 text-sm font-semibold text-danger-700">
          <CircleAlert className="mt-0.5 h-4 w-4 shrink-0" aria-hidden="true" />
          {error}
        </p>
      ) : hint ? (
        <p id={messageId} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
