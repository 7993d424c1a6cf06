"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import type { UnitSystem } from "@/lib/concrete";
import type { getProjectSets } from "@/lib/lab/queries";
import type { MixAcceptance } from "@/lib/checks/strength";
import { AcceptancePanel } from "./acceptance-panel";
import { SetCard } from "./set-card";

type SetsAnswer = Awaited<ReturnType<typeof getProjectSets>>;

async function get<T>(url: string): Promise<T> {
  const res = await callApi<T>(url);
  if (!res.ok) throw new Error(res.error.message);
  return res.data;
}

/** A project's lab: acceptance per mix, then the specimen sets (optionally of one placement). */
export function LabWorkspace({ projectId, placementId, unitSystem, timeZone }: { projectId: string; placementId: string | null; unitSystem: UnitSystem; timeZone: string }) {
  const sets = useQuery({
    queryKey: ["lab-sets", projectId, placementId],
    queryFn: () => get<SetsAnswer>(`/api/projects/${projectId}/lab/sets${placementId ? `?placement=${placementId}` : ""}`),
  });
  const acceptance = useQuery({
    queryKey: ["lab-acceptance", projectId],
    queryFn: () => get<{ mixes: MixAcceptance[] }>(`/api/projects/${projectId}/lab/acceptance`),
  });
  const shownMixes = new Set((sets.data?.sets ?? []).map((s) => s.placement.mixId));
  const mixes = (acceptance.data?.mixes ?? []).filter((m) => !placementId || shownMixes.has(m.mix.id));
  const byMix = new Map((acceptance.data?.mixes ?? []).map((m) => [m.mix.id, m]));
  return (
    <div className="flex flex-col gap-4">
      {placementId ? (
        <p className="text-sm" data-testid="placement-filter">
          Showing the sets of one placement.{" "}
          <Link href={`/projects/${projectId}/lab`} className="font-semibold text-lichen-700 underline">Show every set of the project</Link>
        </p>
      ) : null}
      {sets.data && !sets.data.canEnterBreaks ? <p className="text-sm text-muted" data-testid="read-only-note">The office enters breaks; you can read the results here.</p> : null}
      {sets.isError ? <Notice tone="danger" title={(sets.error as Error).message} /> : null}
      {acceptance.isError ? <Notice tone="danger" title={(acceptance.error as Error).message} /> : null}
      <section aria-labelledby="acceptance-title" className="flex flex-col gap-3">
        <h2 id="acceptance-title" className="text-lg font-bold">Acceptance per mix (ACI 318)</h2>
        {acceptance.isPending ? <p className="text-muted">Loading…</p> : mixes.length === 0 ? <p className="text-muted">No mix with specimen sets yet.</p> : mixes.map((m) => <AcceptancePanel key={m.mix.id} acceptance={m} />)}
      </section>
      <section aria-labelledby="sets-title" className="flex flex-col gap-3">
        <h2 id="sets-title" className="text-lg font-bold">Specimen sets</h2>
        {sets.isPending ? <p className="text-muted">Loading…</p> : sets.data!.sets.length === 0 ? (
          <p className="text-muted" data-testid="no-sets">No specimen sets here yet. The inspector records them in the field.</p>
        ) : (
          sets.data!.sets.map((s) => (
            <SetCard key={s.id} projectId={projectId} set={s} unitSystem={unitSystem} timeZone={timeZone} canEnterBreaks={sets.data!.canEnterBreaks} canEditSets={sets.data!.canEditSets} acceptance={s.placement.mixId ? (byMix.get(s.placement.mixId) ?? null) : null} />
          ))
        )}
      </section>
    </div>
  );
}
