"use client";

// Findings still needing work (open or answered), from this device's copy: on Today (by project)
// and on the placement they hold up. Each links to its visit report.
import { calendarDateText } from "@/lib/time/zone";
import { useLiveQuery } from "dexie-react-hooks";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { Section } from "@/components/field/section";
import { StateBadge } from "@/components/ui/state-badge";
import { isOutstanding } from "@/lib/site-visits/lifecycle";
import { listByProject, type LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";

const SEVERITY_ORDER: Record<string, number> = { critical: 0, major: 1, minor: 2 };

export function useOpenFindings(projectIds: string[], placementId?: string): LocalRecord<"findings">[] | undefined {
  const db = useSyncDb();
  const key = projectIds.join(",");
  return useLiveQuery(async () => {
    const rows = (await Promise.all(projectIds.map((id) => listByProject(db, "findings", id)))).flat();
    return rows
      .filter((f) => !f.deletedAt && isOutstanding(f.state) && (!placementId || f.placementId === placementId))
      .sort((a, b) => (SEVERITY_ORDER[a.severity] ?? 9) - (SEVERITY_ORDER[b.severity] ?? 9) || (a.dueDate ?? "").localeCompare((b.dueDate ?? "")));
  }, [db, key, placementId]);
}

export function OpenFindings({ projectIds, placementId, title = "Open findings" }: { projectIds: string[]; placementId?: string; title?: string }) {
  const rows = useOpenFindings(projectIds, placementId);
  if (!rows || rows.length === 0) return null;
  return (
    <Section title={title} testId="open-findings">
      {placementId ? (
        <Notice tone="caution" title="The inspector's findings hold up this placement" className="mb-3">
          Work them out with the inspector; the project specifications and the engineer of record decide what conforms.
        </Notice>
      ) : null}
      <ul className="flex flex-col gap-2">
        {rows.map((f) => (
          <li key={f.id}>
            <Link href={`/field/visit?id=${f.siteVisitId}#finding-${f.id}`} className="block rounded border border-ink-200 p-3 hover:bg-ink-50" data-testid="open-finding">
              <span className="font-semibold text-ink-950">{f.description}</span>
              <span className="mt-1 flex flex-wrap items-center gap-1.5 text-sm text-muted">
                <StateBadge kind="finding-severity" code={f.severity} size="sm" />
                <StateBadge kind="finding" code={f.state} size="sm" testId="open-finding-state" />
                {[f.location, f.dueDate ? `due ${calendarDateText(f.dueDate)}` : ""].filter(Boolean).join(" · ")}
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </Section>
  );
}
