import clsx from "clsx";
import { CircleCheck, Clock, OctagonAlert } from "lucide-react";
import type { DueStatus } from "@/lib/lab/due";

const STATUS = {
  due: { icon: Clock, label: "Due", box: "border-ink-300 bg-white text-ink-800" },
  overdue: { icon: OctagonAlert, label: "Overdue", box: "border-danger-600 bg-danger-50 text-danger-800" },
  tested: { icon: CircleCheck, label: "Tested", box: "border-lichen-600 bg-lichen-50 text-lichen-900" },
} as const;

/** Word and icon for a due test: never colour alone. */
export function StatusBadge({ status }: { status: DueStatus }) {
  const { icon: Icon, label, box } = STATUS[status];
  return (
    <span className={clsx("inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-semibold", box)} data-testid={`status-${status}`}>
      <Icon className="h-3.5 w-3.5" aria-hidden="true" />
      {label}
    </span>
  );
}
