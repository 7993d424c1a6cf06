"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { ChevronRight, Plus } from "lucide-react";
import dynamic from "next/dynamic";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { OpenFindings } from "@/components/findings/open-findings";
import { FindingBadge } from "@/components/findings/finding-notice";
import type { Finding } from "@/lib/checks";
import { formatLength, formatVolume } from "@/lib/concrete";
import { StateBadge } from "@/components/ui/state-badge";
import { placementStateLabel, textClassOf } from "@/lib/ui/vocabulary";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { mayWrite, unitSystemOf, useFieldContext, useProjects } from "./field-project";
import { addDays, dateInZone, formatDateTime } from "./project-time";
import { byTime } from "./record-fields";
import { CautionBadge } from "./verdict-badges";
import { fieldFindings, placementFindings } from "./findings-model";
import { readFieldRecords } from "./use-findings";
import { formatInstant } from "@/lib/time/zone";

// The planning form (and react-hook-form with it) loads when "Plan a placement" is tapped, not with
// Today; the service worker precaches its chunk, so it opens offline too.
const PlanPlacementForm = dynamic(() => import("./plan-placement-form").then((m) => m.PlanPlacementForm), {
  ssr: false,
  loading: () => <p className="text-muted">Opening the form…</p>,
});

type Row = { placement: LocalRecord<"placements">; project: ProjectRow; day: "today" | "tomorrow"; warnings: string[]; cold: Finding[] };

export function TodayScreen() {
  const db = useSyncDb();
  const projects = useProjects();
  const { selectedProjectId } = useFieldContext();
  const [planning, setPlanning] = useState<string | null>(null);
  const shown = (projects ?? []).filter((p) => !selectedProjectId || p.id === selectedProjectId);
  const projectKey = shown.map((p) => p.id).join(",");

  const rows = useLiveQuery(async () => {
    const out: Row[] = [];
    for (const project of shown) {
      const today = dateInZone(new Date(), project.timeZone);
      const tomorrow = addDays(today, 1);
      const records = await readFieldRecords(db, project);
      // Cold weather as the rulebook finds it under the project's definition (lib/checks).
      let findings: Finding[] = [];
      let unchecked = false;
      try {
        findings = fieldFindings(records, new Date());
      } catch {
        unchecked = true; // said on each card below, never hidden
      }
      for (const placement of records.placements) {
        const day = dateInZone(new Date(placement.plannedStart), project.timeZone);
        if (day !== today && day !== tomorrow) continue;
        const warnings: string[] = [];
        if (placement.pending) warnings.push("Not yet sent");
        if (unchecked) warnings.push("Readings not checked: open the placement");
        const cold = placementFindings(records, findings, placement.id).filter((f) => f.rule === "cold-weather");
        out.push({ placement, project, day: day === today ? "today" : "tomorrow", warnings, cold });
      }
    }
    return out.sort((a, b) => byTime("plannedStart")(a.placement, b.placement));
  }, [db, projectKey]);

  const planners = shown.filter((p) => mayWrite(p, "placement.write"));
  const zone = shown[0]?.timeZone;
  let heading: string;
  try {
    heading = formatInstant(new Date(), zone, "longDay");
  } catch {
    heading = formatInstant(new Date(), undefined, "longDay");
  }
  if (shown.length === 1 && zone) heading += ` · ${shown[0].name}`;

  return (
    <>
      <PageHeader
        title="Today"
        subtitle={heading}
        actions={
          planners.length > 0 && !planning ? (
            <Button data-testid="plan-placement" onClick={() => setPlanning(planners[0].id)}>
              <Plus className="h-5 w-5" aria-hidden="true" /> Plan a placement
            </Button>
          ) : null
        }
      />
      {planning ? (
        <PlanPlacementForm
          projects={planners}
          projectId={planning}
          onProjectChange={setPlanning}
          onDone={() => setPlanning(null)}
        />
      ) : null}
      <div className="mb-3">
        <OpenFindings projectIds={shown.map((p) => p.id)} />
      </div>
      {projects === undefined || rows === undefined ? (
        <p className="text-muted">Reading this device…</p>
      ) : projects.length === 0 ? (
        <div className="card p-5" data-testid="field-no-projects">
          <p className="text-lg font-semibold">No projects on this device yet.</p>
          <p className="mt-1 text-muted">They arrive with the first sync once you are online.</p>
        </div>
      ) : rows.length === 0 ? (
        <div className="card p-5" data-testid="field-today-empty">
          <p className="text-lg font-semibold">No placements planned for today or tomorrow.</p>
        </div>
      ) : (
        <>
        {rows.some((r) => r.placement.state === "held") ? (
          <Notice tone="danger" icon="octagon-pause" title={`${placementStateLabel("held")} by the inspector: do not place`} className="mb-3" testId="today-hold-banner">
            {rows
              .filter((r) => r.placement.state === "held")
              .map((r) => `${r.placement.element}: ${(r.placement.holdReason ?? "") || "no reason given"}`)
              .join(" · ")}
          </Notice>
        ) : null}
        <ul className="grid gap-3 md:grid-cols-2" data-testid="field-today-list">
          {(["today", "tomorrow"] as const).map((day) =>
            rows
              .filter((r) => r.day === day)
              .map(({ placement, project, warnings, cold }, i) => {
                const units = unitSystemOf(project);
                const volume = placement.plannedVolumeM3 ?? undefined;
                const least = placement.leastDimensionMm ?? undefined;
                return (
                  <li key={placement.id} className="contents">
                    {i === 0 ? <h2 className="mt-2 text-sm font-bold uppercase tracking-wide text-ink-600 md:col-span-2">{day === "today" ? "Today" : "Tomorrow"}</h2> : null}
                    <Link
                      href={`/field/placement?id=${placement.id}`}
                      prefetch={false} // the placement screen's code loads on the tap, not with Today
                      data-testid="field-placement-link"
                      className="card flex items-center gap-3 p-4 hover:bg-ink-50"
                    >
                      <div className="min-w-0 flex-1">
                        <div className="flex flex-wrap items-center gap-2">
                          <span className="text-lg font-bold text-ink-950">{placement.element}</span>
                          <StateBadge kind="placement" code={placement.state} testId="placement-state" />
                        </div>
                        <p className="text-sm text-muted">
                          {project.name} · {[placement.level, placement.grid].filter(Boolean).join(" · ") || "no location"}
                        </p>
                        <p className="mt-1 text-base text-ink-900">
                          {formatDateTime(placement.plannedStart, project.timeZone)}
                          {volume !== undefined ? ` · ${formatVolume(volume, units)}` : ""}
                          {least !== undefined ? ` · least ${formatLength(least, units)}` : ""}
                        </p>
                        {placement.state === "held" ? (
                          <p className={`mt-2 text-base font-semibold ${textClassOf("placement", "held")}`} data-testid="today-hold-reason">
                            {placementStateLabel("held")} by the inspector: {(placement.holdReason ?? "") || "no reason given"}
                          </p>
                        ) : null}
                        {warnings.length > 0 ? (
                          <div className="mt-2 flex flex-wrap gap-1">
                            {warnings.map((w) => (
                              <CautionBadge key={w}>{w}</CautionBadge>
                            ))}
                          </div>
                        ) : null}
                        {cold.map((f) => (
                          <div key={f.subject.id} className="mt-2">
                            <FindingBadge finding={f} testId="today-cold-weather" />
                          </div>
                        ))}
                      </div>
                      <ChevronRight className="h-6 w-6 shrink-0 text-ink-500" aria-hidden="true" />
                    </Link>
                  </li>
                );
              }),
          )}
        </ul>
        </>
      )}
    </>
  );
}
