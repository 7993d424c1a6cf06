import clsx from "clsx";
import { Select } from "./select";

type PickerProject = { id: string; name: string };

/**
 * The one project picker: "All my projects" (the empty value) and the user's projects by name.
 * `header` is the compact dark control of the app and field headers (label for screen readers
 * only); `form` is a labelled select among filters.
 */
export function ProjectPicker({
  projects,
  value,
  onChange,
  testId,
  look,
  className,
}: {
  projects: readonly PickerProject[];
  value: string;
  onChange: (projectId: string) => void;
  testId: string;
  look: "header" | "form";
  className?: string;
}) {
  const options = (
    <>
      <option value="">All my projects</option>
      {projects.map((p) => (
        <option key={p.id} value={p.id}>
          {p.name}
        </option>
      ))}
    </>
  );
  if (look === "form") {
    return (
      <Select label="Project" value={value} onChange={(e) => onChange(e.target.value)} data-testid={testId} className={className}>
        {options}
      </Select>
    );
  }
  return (
    <label className="flex min-w-0 items-center">
      <span className="sr-only">Project</span>
      <select
        data-testid={testId}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className={clsx("min-h-11 truncate rounded-md border border-ink-600 bg-ink-800 px-2 text-sm font-semibold text-white sm:max-w-xs", className)}
      >
        {options}
      </select>
    </label>
  );
}
