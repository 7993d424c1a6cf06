"use client";

// Small dense controls of the review screen: a checkbox menu (projects, states, columns) and a date.
import clsx from "clsx";
import { ChevronDown } from "lucide-react";

export function CheckMenu({
  label,
  options,
  selected,
  onChange,
  testId,
  emptyText = "All",
}: {
  label: string;
  options: { value: string; label: string }[];
  selected: string[];
  onChange: (next: string[]) => void;
  testId: string;
  emptyText?: string;
}) {
  const summary =
    selected.length === 0
      ? emptyText
      : selected.length === 1
        ? (options.find((o) => o.value === selected[0])?.label ?? "1 chosen")
        : `${selected.length} chosen`;
  return (
    <details className="group relative" data-testid={testId}>
      <summary className="flex cursor-pointer list-none flex-col gap-0.5 [&::-webkit-details-marker]:hidden">
        <span className="text-xs font-semibold text-ink-700">{label}</span>
        <span className="inline-flex h-9 min-w-36 items-center justify-between gap-2 rounded-md border border-ink-300 bg-white px-2 text-sm">
          <span className="truncate">{summary}</span>
          <ChevronDown className="h-4 w-4 shrink-0 transition group-open:rotate-180" aria-hidden="true" />
        </span>
      </summary>
      <div className="absolute z-30 mt-1 max-h-80 min-w-56 overflow-auto rounded-md border border-ink-200 bg-white p-1 shadow-lg">
        {options.map((o) => (
          <label key={o.value} className="flex cursor-pointer items-center gap-2 rounded px-2 py-1 text-sm hover:bg-ink-50">
            <input
              type="checkbox"
              className="h-4 w-4"
              checked={selected.includes(o.value)}
              onChange={(e) => onChange(e.target.checked ? [...selected, o.value] : selected.filter((v) => v !== o.value))}
            />
            {o.label}
          </label>
        ))}
      </div>
    </details>
  );
}

export function SmallDate({ label, value, onChange, testId }: { label: string; value: string; onChange: (v: string) => void; testId: string }) {
  return (
    <label className="flex flex-col gap-0.5">
      <span className="text-xs font-semibold text-ink-700">{label}</span>
      <input
        type="date"
        data-testid={testId}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="h-9 rounded-md border border-ink-300 bg-white px-2 text-sm"
      />
    </label>
  );
}

export function SmallSelect({
  label,
  value,
  onChange,
  options,
  testId,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: { value: string; label: string }[];
  testId: string;
}) {
  return (
    <label className="flex flex-col gap-0.5">
      <span className="text-xs font-semibold text-ink-700">{label}</span>
      <select data-testid={testId} value={value} onChange={(e) => onChange(e.target.value)} className="h-9 rounded-md border border-ink-300 bg-white px-2 text-sm">
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export const smallButton = (tone: "primary" | "secondary" = "secondary") =>
  clsx(
    // A finger-sized target on a phone; compact beside the table on a desktop, where it is clicked.
    "inline-flex min-h-touch items-center gap-1.5 whitespace-nowrap rounded-md px-3 py-1.5 text-sm font-semibold disabled:opacity-50 md:min-h-0",
    tone === "primary" ? "bg-lichen-700 text-white hover:bg-lichen-800" : "border border-ink-300 bg-white text-ink-900 hover:bg-ink-50",
  );
