import { StateBadge } from "@/components/ui/state-badge";
import type { DueStatus } from "@/lib/lab/due";

/** Word, icon and colour of a due test, from the vocabulary: never colour alone. */
export function StatusBadge({ status }: { status: DueStatus }) {
  return <StateBadge kind="lab-due" code={status} size="sm" testId={`status-${status}`} />;
}
