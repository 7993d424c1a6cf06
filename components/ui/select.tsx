import clsx from "clsx";
import { forwardRef, useId } from "react";

type SelectProps = React.SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string };

export const Select = forwardRef<HTMLSelectElement, SelectProps>(function Select(
  { label, error, className, id, children, ...props },
  ref,
) {
  const autoId = useId();
  const selectId = id ?? autoId;
  return (
    <div className={clsx("flex min-w-0 flex-col gap-1", className)}>
      <label htmlFor={selectId} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      <select
        ref={ref}
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${selectId}-error` : undefined}
        className={clsx(
          "min-h-touch rounded-lg border bg-white px-3 text-base text-ink-950",
          error ? "border-danger-600" : "border-ink-300",
        )}
        {...props}
      >
        {children}
      </select>
      {error ? (
        <p id={`${selectId}-error`} className="text-sm font-medium text-danger-700" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
});
