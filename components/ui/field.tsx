import clsx from "clsx";
import { forwardRef, useId } from "react";

type FieldProps = React.InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  error?: string;
  hint?: string;
  unit?: string;
};

/** Label, input, unit and error in one: the error is tied to the input for screen readers. */
export const Field = forwardRef<HTMLInputElement, FieldProps>(function Field(
  { label, error, hint, unit, className, id, ...props },
  ref,
) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const describedBy = error ? `${inputId}-error` : hint ? `${inputId}-hint` : undefined;
  return (
    <div className={clsx("flex min-w-0 flex-col gap-1", className)}>
      <label htmlFor={inputId} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      <div className="flex items-stretch">
        <input
          ref={ref}
          id={inputId}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={clsx(
            "min-h-touch w-full min-w-0 rounded-lg border bg-white px-3 text-base text-ink-950 placeholder:text-ink-400",
            "focus:outline-2 focus:outline-offset-1 focus:outline-lichen-600",
            unit && "rounded-r-none",
            error ? "border-danger-600" : "border-ink-300",
          )}
          {...props}
        />
        {unit ? (
          <span className="inline-flex items-center rounded-r-lg border border-l-0 border-ink-300 bg-ink-50 px-3 text-sm font-semibold text-ink-700">
            {unit}
          </span>
        ) : null}
      </div>
      {error ? (
        <p id={`${inputId}-error`} className="text-sm font-medium text-danger-700" role="alert">
          {error}
        </p>
      ) : hint ? (
        <p id={`${inputId}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
});
