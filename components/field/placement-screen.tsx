"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { ArrowLeft } from "lucide-react";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatLength, formatVolume } from "@/lib/concrete";
import type { ProjectRole } from "@/lib/auth/roles";
import { allowedTransitions, describeAllowed } from "@/lib/placements/workflow";
import { PLACEMENT_MOVE_WORDS } from "@/lib/ui/vocabulary";
import { elementTypeLabel } from "@/lib/ui/vocabulary";
import { StateBadge } from "@/components/ui/state-badge";
import type { PlacementState } from "@/lib/records/enums";
import { getRecord, transitionLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { unitSystemOf, useProject } from "./field-project";
import { formatDateTime } from "./project-time";
import { Section } from "./section";
import { useDeviceWrite } from "./use-device-write";
import { ConcreteInPlace } from "@/components/inspection/concrete-in-place";
import { HoldBanner } from "@/components/inspection/hold-banner";
import { OpenFindings } from "@/components/findings/open-findings";
import { ReadinessCheck, useReadiness } from "@/components/inspection/readiness-check";
import { AuditTrail } from "@/components/audit/audit-trail";
import { PlacementSignOff } from "@/components/signoff/placement-sign-off";
import { FieldMaturity } from "@/components/maturity/field-maturity";
import { CuringLog } from "./curing-log";
import { Deliveries } from "./deliveries";
import { FieldTests } from "./field-tests";
import { useFindings } from "./use-findings";
import { WeatherWatch } from "./weather-watch";

function Transitions({ placement, project, readyBlockedBy = [] }: { placement: LocalRecord<"placements">; project: ProjectRow; readyBlockedBy?: string[] }) {
  const db = useSyncDb();
  const state = placement.state as PlacementState;
  const role = (project.role ?? null) as ProjectRole | null;
  const allowed = allowedTransitions(state, role);
  const [holding, setHolding] = useState(false);
  const [reason, setReason] = useState("");
  const { error, run } = useDeviceWrite();

  const move = (to: PlacementState, why?: string) =>
    run(async () => {
      await transitionLocal(db, placement.id, to, why);
      setHolding(false);
      setReason("");
    });

  return (
    <div className="mt-4 border-t border-ink-200 pt-3" data-testid="placement-transitions">
      <p className="text-sm text-muted" data-testid="placement-who-next">
        {describeAllowed(state, role)}
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        {allowed.filter((to) => to !== "held" && to !== "signed").map((to) => (
          <Button
            key={to}
            variant={to === "planned" ? "secondary" : "primary"}
            data-testid={`transition-${to}`}
            disabled={to === "ready" && readyBlockedBy.length > 0}
            title={to === "ready" && readyBlockedBy.length > 0 ? readyBlockedBy.join(" ") : undefined}
            onClick={() => void move(to)}
          >
            {PLACEMENT_MOVE_WORDS[to].button}
          </Button>
        ))}
        {allowed.includes("held") && !holding ? (
          <Button variant="secondary" data-testid="transition-held" onClick={() => setHolding(true)}>
            {PLACEMENT_MOVE_WORDS.held.button}…
          </Button>
        ) : null}
      </div>
      {allowed.includes("ready") && readyBlockedBy.length > 0 ? (
        <p className="mt-2 text-sm text-ink-800" data-testid="ready-blocked">
          Answer the readiness check first: {readyBlockedBy[0]}
        </p>
      ) : null}
      {holding ? (
        <form
          className="mt-3 flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            void move("held", reason.trim());
          }}
        >
          <ConcreteInPlace placement={placement} project={project} className="text-sm font-semibold text-ink-950" />
          <Field label="Reason for the hold" value={reason} onChange={(e) => setReason(e.target.value)} data-testid="hold-reason" />
          <div className="flex gap-2">
            <Button type="submit" disabled={!reason.trim()}>
              Hold the placement
            </Button>
            <Button variant="secondary" onClick={() => setHolding(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : null}
      {error ? (
        <Notice tone="danger" title="Not changed" className="mt-2">
          {error}
        </Notice>
      ) : null}
    </div>
  );
}

export function PlacementScreen() {
  const db = useSyncDb();
  const id = useSearchParams().get("id");
  const placement = useLiveQuery(async () => (await getRecord(db, "placements", id)) ?? null, [db, id]);
  const memberProject = useProject(placement?.projectId);
  const readiness = useReadiness(id);
  // One reading of the rulebook for every section of the placement (lib/checks via the field model).
  const checks = useFindings(placement?.projectId, placement?.id);
  // A signed placement is read-only for everyone: its sections see a role that writes nothing.
  const project = memberProject && placement?.state === "signed" ? { ...memberProject, role: "owner" as const } : memberProject;
  const mix = useLiveQuery(
    async () => (placement?.mixId ? ((await getRecord(db, "mix-designs", placement.mixId)) ?? null) : null),
    [db, placement?.mixId],
  );

  const back = (
    <Link href="/field/today" className="mb-3 inline-flex min-h-touch items-center gap-1 font-semibold text-lichen-800" data-testid="back-to-today">
      <ArrowLeft className="h-5 w-5" aria-hidden="true" /> Today
    </Link>
  );
  if (placement === undefined) return <p className="text-muted">Reading this device…</p>;
  if (placement === null || !project) {
    return (
      <>
        {back}
        <Notice tone="info" title="This placement is not on this device." testId="placement-missing">
          It may belong to a project you are not on, or it has not synced yet.
        </Notice>
      </>
    );
  }
  const units = unitSystemOf(project);
  const volume = placement.plannedVolumeM3 ?? undefined;
  const least = placement.leastDimensionMm ?? undefined;

  return (
    <div className="flex flex-col gap-4">
      <div>
        {back}
        <div className="flex flex-wrap items-center gap-2">
          <h1 className="text-2xl font-bold tracking-tight text-ink-950" data-testid="placement-title">
            {placement.element}
          </h1>
          <StateBadge kind="placement" code={placement.state} testId="placement-state" />
        </div>
        <p className="text-muted">{project.name}</p>
      </div>
      <HoldBanner placement={placement} project={project} />
      <OpenFindings projectIds={[placement.projectId]} placementId={placement.id} title="Open findings on this placement" />

      <Section title="Plan" testId="placement-plan">
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-base">
          <dt className="text-sm text-muted">Location</dt>
          <dd className="font-semibold">{[placement.level, placement.grid].filter(Boolean).join(" · ") || "—"}</dd>
          <dt className="text-sm text-muted">Element type</dt>
          <dd className="font-semibold">{elementTypeLabel(placement.elementType)}</dd>
          <dt className="text-sm text-muted">Least dimension</dt>
          <dd className="font-semibold">{least !== undefined ? formatLength(least, units) : "—"}</dd>
          <dt className="text-sm text-muted">Planned volume</dt>
          <dd className="font-semibold">{volume !== undefined ? formatVolume(volume, units) : "—"}</dd>
          <dt className="text-sm text-muted">Mix</dt>
          <dd className="font-semibold">{mix ? mix.code : "Not chosen"}</dd>
          <dt className="text-sm text-muted">Planned start</dt>
          <dd className="font-semibold">{formatDateTime(placement.plannedStart, project.timeZone)}</dd>
        </dl>
        <Transitions placement={placement} project={project} readyBlockedBy={readiness?.verdict.problems} />
        <RecordPhotos projectId={project.id} recordType="placements" recordId={placement.id} canAdd={canAddPhotos(project, placement)} />
      </Section>

      <PlacementSignOff placement={placement} project={memberProject ?? project} mix={mix ?? null} />
      <ReadinessCheck placement={placement} project={project} readiness={readiness} />

      <Deliveries placement={placement} project={project} checks={checks} />
      <FieldTests placement={placement} project={project} mix={mix ?? null} checks={checks} />
      <WeatherWatch placement={placement} project={project} mix={mix ?? null} checks={checks} />
      <CuringLog placement={placement} project={project} checks={checks} />
      <FieldMaturity placement={placement} project={project} mix={mix ?? null} />
      <AuditTrail projectId={placement.projectId} recordId={placement.id} timeZone={project.timeZone} />
    </div>
  );
}
