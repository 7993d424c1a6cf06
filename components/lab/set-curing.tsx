"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { SetLoggerSelect } from "@/components/maturity/set-logger-select";
import { callApi } from "@/lib/api/client";
import { curingBasisLabel } from "@/lib/ui/vocabulary";

type Props = { projectId: string; set: { id: string; version: number; sensorId: string | null; sensors: { id: string; name: string }[] }; canEdit: boolean };

/** How the set is cured (a logger of its placement or standard curing); the office may change it. */
export function SetCuring({ projectId, set, canEdit }: Props) {
  const queryClient = useQueryClient();
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const current = set.sensors.find((s) => s.id === set.sensorId);
  if (!canEdit) {
    return <p className="mt-1 text-sm" data-testid="set-curing">{curingBasisLabel(current?.name ?? null)}</p>;
  }
  const choose = async (sensorId: string) => {
    setFailure(null);
    setSaving(true);
    const res = await callApi(`/api/projects/${projectId}/records/specimen-sets/${set.id}`, {
      method: "PATCH",
      body: { baseVersion: set.version, patch: { sensorId: sensorId || null } },
    });
    setSaving(false);
    if (!res.ok) return setFailure(res.error.message);
    await queryClient.invalidateQueries({ queryKey: ["lab-sets", projectId] });
  };
  return (
    <div className="mt-2 max-w-sm" data-testid="set-curing">
      <SetLoggerSelect sensors={set.sensors} value={set.sensorId ?? ""} disabled={saving} onChange={(e) => void choose(e.target.value)} error={failure ?? undefined} testId="set-curing-select" />
    </div>
  );
}
