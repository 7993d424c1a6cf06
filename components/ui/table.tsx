import clsx from "clsx";

/** A header cell: its text, or the text with how to show it. `hidden` keeps the text for screen readers only. */
export type Column = string | { label: string; align?: "right"; hidden?: boolean };

/**
 * The app's plain data table: one header style, row dividers, and two densities (compact for tables
 * inside a card). Rows are the caller's; a falsy column (a column shown only to some) is left out.
 */
export function Table({
  columns,
  testId,
  compact = false,
  caption,
  className,
  children,
}: {
  columns: (Column | null | false)[];
  testId?: string;
  compact?: boolean;
  caption?: React.ReactNode;
  className?: string;
  children: React.ReactNode;
}) {
  return (
    <table className={clsx("w-full text-left text-sm", className)} data-testid={testId}>
      {caption ? <caption className="pb-1 text-left font-semibold text-ink-800">{caption}</caption> : null}
      <thead className="bg-ink-50 text-ink-700">
        <tr>
          {columns.filter((c): c is Column => Boolean(c)).map((c) => {
            const { label, align, hidden } = typeof c === "string" ? { label: c, align: undefined, hidden: false } : c;
            return (
              <th key={label} scope="col" className={clsx(compact ? "px-2 py-1" : "px-3 py-2", align === "right" && "text-right")}>
                {hidden ? <span className="sr-only">{label}</span> : label}
              </th>
            );
          })}
        </tr>
      </thead>
      <tbody className="divide-y divide-ink-100">{children}</tbody>
    </table>
  );
}
