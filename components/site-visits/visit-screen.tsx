"use client";

// The visit report (?id=): date, times on site, areas and elements inspected, tests witnessed,
// weather; its findings; submit and sign. Everything is written on the device first and synced.
import { useLiveQuery } from "dexie-react-hooks";
import { ArrowLeft } from "lucide-react";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useProject } from "@/components/field/field-project";
import { formatDay } from "@/components/field/project-time";
import { Section } from "@/components/field/section";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { SignOffDialog } from "@/components/signoff/lazy-sign-off-dialog";
import type { ProjectRole } from "@/lib/auth/roles";
import type { SiteVisitState } from "@/lib/records/enums";
import { allowedMoves, describeMoves, isOutstanding } from "@/lib/site-visits/lifecycle";
import { StateBadge } from "@/components/ui/state-badge";
import { SITE_VISIT_MOVE_WORDS } from "@/lib/ui/vocabulary";
import { getRecord, listByParent, listByProject, transitionSiteRecordLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useRequestSync, useSyncDb } from "@/lib/sync/client/react";
import { AddFinding } from "./add-finding";
import { FindingCard } from "./finding-card";
import { ReportForm, ReportView } from "./report-form";

function SubmitAndSign({ visit, project, findings }: { visit: LocalRecord<"site-visits">; project: ProjectRow; findings: LocalRecord<"findings">[] }) {
  const db = useSyncDb();
  const requestSync = useRequestSync();
  const [open, setOpen] = useState(false);
  const { error, run } = useDeviceWrite();
  const state = visit.state as SiteVisitState;
  const role = (project.role ?? null) as ProjectRole | null;
  const moves = allowedMoves("site-visits", state, role);
  const outstanding = findings.filter((f) => isOutstanding(f.state));
  const version = visit.version ?? 0;
  const move = (to: string) => run(() => transitionSiteRecordLocal(db, "site-visits", visit.id, { to }));
  if (state === "signed") {
    return (
      <Notice tone="success" title="Signed" testId="visit-signed">
        This visit report is signed and cannot change; add an amendment instead. Findings go on being answered and closed.
      </Notice>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-muted" data-testid="visit-who-next">
        {describeMoves("site-visits", state, role)}
      </p>
      <div className="flex flex-wrap gap-2">
        {moves.map((m) => (
          <Button key={m.to} variant={m.to === "draft" ? "secondary" : "primary"} data-testid={`visit-${m.to}`} onClick={() => void move(m.to)}>
            {SITE_VISIT_MOVE_WORDS[m.to as SiteVisitState].button}
          </Button>
        ))}
        {state === "submitted" && role === "inspector" ? (
          <Button data-testid="visit-sign" onClick={() => setOpen(true)}>
            Sign the report…
          </Button>
        ) : null}
      </div>
      {error ? <Notice tone="danger" title="Not changed">{error}</Notice> : null}
      <SignOffDialog
        open={open}
        endpoint={`/api/projects/${project.id}/site-visits/${visit.id}/sign-off`}
        baseVersion={version}
        title="Sign the visit report"
        summary={
          <div className="text-sm">
            <p>
              Visit of {formatDay(visit.visitDate)}: {findings.length} finding{findings.length === 1 ? "" : "s"}, {outstanding.length} still open or answered.
            </p>
            {outstanding.length ? <p className="mt-1">The signed report lists them as open; they are closed after re-inspection.</p> : null}
          </div>
        }
        blockedReason={version < 1 || visit.pending ? "This report has changes not yet on the server. Sync, then sign." : null}
        onClose={() => setOpen(false)}
        onSigned={() => {
          setOpen(false);
          requestSync();
        }}
      />
    </div>
  );
}

export function VisitScreen() {
  const db = useSyncDb();
  const id = useSearchParams().get("id");
  const visit = useLiveQuery(async () => (await getRecord(db, "site-visits", id)) ?? null, [db, id]);
  const project = useProject(visit?.projectId);
  const findings = useLiveQuery(async () => (id ? (await listByParent(db, "findings", "siteVisitId", id)).filter((f) => !f.deletedAt) : []), [db, id]);
  const placements = useLiveQuery(async () => (visit ? (await listByProject(db, "placements", visit.projectId)).filter((p) => !p.deletedAt) : []), [db, visit?.projectId]);

  const back = (
    <Link href="/field/visits" className="mb-3 inline-flex min-h-touch items-center gap-1 font-semibold text-lichen-800">
      <ArrowLeft className="h-5 w-5" aria-hidden="true" /> Site visits
    </Link>
  );
  if (visit === undefined) return <p className="text-muted">Reading this device…</p>;
  if (visit === null || !project) {
    return (
      <>
        {back}
        <Notice tone="info" title="This visit report is not on this device." testId="visit-missing">
          It may belong to a project you are not on, or it has not synced yet.
        </Notice>
      </>
    );
  }
  const state = visit.state as SiteVisitState;
  const inspector = project.role === "inspector";
  const editable = inspector && state === "draft";
  return (
    <div className="flex flex-col gap-4">
      <div>
        {back}
        <div className="flex flex-wrap items-center gap-2" data-testid="visit-title">
          <h1 className="text-2xl font-bold tracking-tight text-ink-950">Site visit {formatDay(visit.visitDate)}</h1>
          <StateBadge kind="site-visit" code={state} testId="visit-state" />
        </div>
        <p className="text-muted">{project.name}</p>
      </div>
      <Section title="Report" testId="visit-report">
        {editable ? (
          <ReportForm key={`${visit.id}-${visit.version}`} visit={visit} timeZone={project.timeZone} />
        ) : (
          <ReportView visit={visit} timeZone={project.timeZone} />
        )}
      </Section>
      <Section title="Findings" testId="visit-findings">
        {findings && findings.length > 0 ? (
          <ul className="mb-3 flex flex-col gap-2">
            {findings.map((f) => (
              <FindingCard key={f.id} finding={f} project={project} placements={placements ?? []} />
            ))}
          </ul>
        ) : (
          <p className="mb-3 text-muted">No findings on this visit.</p>
        )}
        {inspector && state !== "signed" ? <AddFinding visit={visit} placements={placements ?? []} /> : null}
      </Section>
      <SubmitAndSign visit={visit} project={project} findings={findings ?? []} />
    </div>
  );
}
