"use client";

// The inspection log on this device: every visit report of the projects shown, newest first; the
// inspector starts a new one here (works offline, same sync path as every field record).
import { useLiveQuery } from "dexie-react-hooks";
import { ChevronRight } from "lucide-react";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { useFieldContext, useProjects } from "@/components/field/field-project";
import { formatDay } from "@/components/field/project-time";
import { isOutstanding } from "@/lib/site-visits/lifecycle";
import { StateBadge } from "@/components/ui/state-badge";
import { FINDING_STATE_WORDS, textClassOf } from "@/lib/ui/vocabulary";
import { listByProject } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { NewVisit } from "./new-visit";

export function VisitsScreen() {
  const db = useSyncDb();
  const projects = useProjects();
  const { selectedProjectId } = useFieldContext();
  const shown = (projects ?? []).filter((p) => !selectedProjectId || p.id === selectedProjectId);
  const key = shown.map((p) => p.id).join(",");

  const rows = useLiveQuery(async () => {
    const out = [];
    for (const project of shown) {
      const [visits, findings] = await Promise.all([listByProject(db, "site-visits", project.id), listByProject(db, "findings", project.id)]);
      for (const visit of visits) {
        if (visit.deletedAt) continue;
        const outstanding = findings.filter((f) => f.siteVisitId === visit.id && !f.deletedAt && isOutstanding(f.state)).length;
        out.push({ visit, project, outstanding });
      }
    }
    return out.sort((a, b) => b.visit.visitDate.localeCompare(a.visit.visitDate));
  }, [db, key]);

  return (
    <>
      <PageHeader
        title="Site visits"
        subtitle="The inspector's visit reports and their findings"
        actions={<NewVisit projects={projects ?? []} shownId={selectedProjectId} />}
      />
      {rows === undefined ? (
        <p className="text-muted">Reading this device…</p>
      ) : rows.length === 0 ? (
        <div className="card p-5" data-testid="visits-empty">
          <p className="text-lg font-semibold">No visit reports on this device yet.</p>
        </div>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2" data-testid="visits-list">
          {rows.map(({ visit, project, outstanding }) => (
            <li key={visit.id}>
              <Link href={`/field/visit?id=${visit.id}`} className="card flex items-center gap-3 p-4 hover:bg-ink-50" data-testid="visit-link">
                <div className="min-w-0 flex-1">
                  <p className="flex flex-wrap items-center gap-2 text-lg font-bold text-ink-950">
                    {formatDay(visit.visitDate)} <StateBadge kind="site-visit" code={visit.state} size="sm" testId="visit-state" />
                  </p>
                  <p className="text-sm text-muted">
                    {project.name}
                    {visit.areasInspected ? ` · ${visit.areasInspected}` : ""}
                  </p>
                  {outstanding > 0 ? <p className={`mt-1 font-semibold ${textClassOf("finding", "open")}`}>{outstanding} {FINDING_STATE_WORDS.open.label.toLowerCase()} finding{outstanding === 1 ? "" : "s"}</p> : null}
                </div>
                <ChevronRight className="h-6 w-6 shrink-0 text-ink-500" aria-hidden="true" />
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
