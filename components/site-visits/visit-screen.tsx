"use client";

// The visit report (?id=): date, times on site, areas and elements inspected, tests witnessed,
// weather; its findings; submit and sign. Everything is written on the device first and synced.
import { useLiveQuery } from "dexie-react-hooks";
import { ArrowLeft } from "lucide-react";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Section, fromTimeInput, num, str, toTimeInput, useProject, writeErrorOf } from "@/components/field/common";
import { SignOffDialog } from "@/components/signoff/lazy-sign-off-dialog";
import type { ProjectRole } from "@/lib/auth/roles";
import { FINDING_SEVERITIES, type SiteVisitState } from "@/lib/records/enums";
import { allowedMoves, isOutstanding } from "@/lib/site-visits/lifecycle";
import { StateBadge } from "@/components/ui/state-badge";
import { SITE_VISIT_MOVE_WORDS } from "@/lib/ui/vocabulary";
import { createLocal, getRecord, listByParent, listByProject, transitionSiteRecordLocal, updateLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useRequestSync, useSyncDb } from "@/lib/sync/client/react";
import { FindingCard } from "./finding-card";

const REPORT_FIELDS = [
  ["areasInspected", "Areas inspected"],
  ["elementsInspected", "Elements inspected"],
  ["testsWitnessed", "Tests witnessed"],
  ["weather", "Weather"],
  ["notes", "Notes"],
] as const;

function ReportForm({ visit, editable }: { visit: LocalRecord; editable: boolean }) {
  const db = useSyncDb();
  const [values, setValues] = useState<Record<string, string>>(() => ({
    visitDate: str(visit.visitDate),
    arrived: toTimeInput(str(visit.arrivedAt) || null),
    left: toTimeInput(str(visit.leftAt) || null),
    ...Object.fromEntries(REPORT_FIELDS.map(([k]) => [k, str(visit[k])])),
  }));
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const set = (k: string) => (e: React.ChangeEvent<HTMLInputElement>) => {
    setSaved(false);
    setValues((v) => ({ ...v, [k]: e.target.value }));
  };
  const save = async () => {
    setError(null);
    try {
      const { arrived, left, ...rest } = values;
      await updateLocal(db, "site-visits", visit.id, { ...rest, arrivedAt: fromTimeInput(arrived, values.visitDate), leftAt: fromTimeInput(left, values.visitDate) });
      setSaved(true);
    } catch (e) {
      setError(writeErrorOf(e).message);
    }
  };
  return (
    <form
      className="grid gap-3 md:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <Field label="Visit date" type="date" value={values.visitDate} onChange={set("visitDate")} disabled={!editable} data-testid="visit-date" />
      <div className="grid grid-cols-2 gap-2">
        <Field label="On site from" type="time" value={values.arrived} onChange={set("arrived")} disabled={!editable} />
        <Field label="to" type="time" value={values.left} onChange={set("left")} disabled={!editable} />
      </div>
      {REPORT_FIELDS.map(([k, label]) => (
        <Field key={k} label={label} value={values[k]} onChange={set(k)} disabled={!editable} data-testid={`visit-${k}`} />
      ))}
      {editable ? (
        <div className="flex items-center gap-2 md:col-span-2">
          <Button type="submit" data-testid="visit-save">
            Save report
          </Button>
          {saved ? <span className="text-sm text-muted">Saved on this device</span> : null}
        </div>
      ) : null}
      {error ? (
        <Notice tone="danger" title="Not saved" className="md:col-span-2">
          {error}
        </Notice>
      ) : null}
    </form>
  );
}

function AddFinding({ visit, placements }: { visit: LocalRecord; placements: LocalRecord[] }) {
  const db = useSyncDb();
  const empty = { description: "", location: "", severity: "major", requirement: "", actionRequired: "", dueDate: "", placementId: "" };
  const [v, setV] = useState(empty);
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const set = (k: keyof typeof empty) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV((x) => ({ ...x, [k]: e.target.value }));
  if (!open) {
    return (
      <Button variant="secondary" data-testid="add-finding" onClick={() => setOpen(true)}>
        Add a finding
      </Button>
    );
  }
  const save = async () => {
    setError(null);
    try {
      await createLocal(db, "findings", visit.projectId, { ...v, siteVisitId: visit.id, dueDate: v.dueDate || null, placementId: v.placementId || null });
      setV(empty);
      setOpen(false);
    } catch (e) {
      setError(writeErrorOf(e).message);
    }
  };
  return (
    <form
      className="grid gap-3 rounded border border-ink-200 p-3 md:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <Field label="What does not conform" value={v.description} onChange={set("description")} data-testid="finding-description" />
      <Field label="Where" value={v.location} onChange={set("location")} data-testid="finding-location" />
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
        Severity
        <select className="min-h-touch rounded border border-ink-300 px-2 text-base font-normal" value={v.severity} onChange={set("severity")} data-testid="finding-severity">
          {FINDING_SEVERITIES.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
      </label>
      <Field label="Requirement it breaks (spec section or drawing)" value={v.requirement} onChange={set("requirement")} data-testid="finding-requirement" />
      <Field label="Action required" value={v.actionRequired} onChange={set("actionRequired")} data-testid="finding-action" />
      <Field label="By (due date)" type="date" value={v.dueDate} onChange={set("dueDate")} data-testid="finding-due" />
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
        Placement it holds up
        <select className="min-h-touch rounded border border-ink-300 px-2 text-base font-normal" value={v.placementId} onChange={set("placementId")} data-testid="finding-placement">
          <option value="">None</option>
          {placements.map((p) => (
            <option key={p.id} value={p.id}>
              {str(p.element)}
            </option>
          ))}
        </select>
      </label>
      <div className="flex gap-2 md:col-span-2">
        <Button type="submit" data-testid="finding-save">
          Save finding
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      {error ? (
        <Notice tone="danger" title="Not saved" className="md:col-span-2">
          {error}
        </Notice>
      ) : null}
    </form>
  );
}

function SubmitAndSign({ visit, project, findings }: { visit: LocalRecord; project: ProjectRow; findings: LocalRecord[] }) {
  const db = useSyncDb();
  const requestSync = useRequestSync();
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const state = str(visit.state) as SiteVisitState;
  const role = (project.role ?? null) as ProjectRole | null;
  const moves = allowedMoves("site-visits", state, role);
  const outstanding = findings.filter((f) => isOutstanding(f.state));
  const version = num(visit.version) ?? 0;
  const move = async (to: string) => {
    setError(null);
    try {
      await transitionSiteRecordLocal(db, "site-visits", visit.id, { to });
    } catch (e) {
      setError(writeErrorOf(e).message);
    }
  };
  if (state === "signed") {
    return (
      <Notice tone="success" title="Signed" testId="visit-signed">
        This visit report is signed and cannot change; add an amendment instead. Findings go on being answered and closed.
      </Notice>
    );
  }
  return (
    <div className="flex flex-col gap-2">
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
              Visit of {str(visit.visitDate)}: {findings.length} finding{findings.length === 1 ? "" : "s"}, {outstanding.length} still open or answered.
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
  const state = str(visit.state) as SiteVisitState;
  const inspector = project.role === "inspector";
  const editable = inspector && state === "draft";
  return (
    <div className="flex flex-col gap-4">
      <div>
        {back}
        <div className="flex flex-wrap items-center gap-2" data-testid="visit-title">
          <h1 className="text-2xl font-bold tracking-tight text-ink-950">Site visit {str(visit.visitDate)}</h1>
          <StateBadge kind="site-visit" code={state} testId="visit-state" />
        </div>
        <p className="text-muted">{project.name}</p>
      </div>
      <Section title="Report" testId="visit-report">
        <ReportForm key={`${visit.id}-${num(visit.version)}`} visit={visit} editable={editable} />
      </Section>
      <Section title="Findings" testId="visit-findings">
        {findings && findings.length > 0 ? (
          <ul className="mb-3 flex flex-col gap-2">
            {findings.map((f) => (
              <FindingCard key={f.id} finding={f} project={project} />
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
