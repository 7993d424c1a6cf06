"use client";

import { FormFooter } from "./form-footer";
import { useLiveQuery } from "dexie-react-hooks";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field } from "@/components/ui/field";
import { ELEMENT_TYPES } from "@/lib/records/enums";
import { ELEMENT_TYPE_LABELS } from "@/lib/ui/vocabulary";
import { createLocal, listByProject, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { unitSystemOf } from "./field-project";
import { fromLocalInput, toLocalInput } from "./project-time";
import { toSI, unitLabel } from "./unit-inputs";
import { writeErrorOf } from "./write-error";
import { Section } from "./section";

type Values = {
  element: string;
  level: string;
  grid: string;
  elementType: string;
  leastDimension: string;
  plannedVolume: string;
  mixId: string;
  plannedStart: string;
};

export function PlanPlacementForm({
  projects,
  projectId,
  onProjectChange,
  onDone,
}: {
  projects: ProjectRow[];
  projectId: string;
  onProjectChange: (id: string) => void;
  onDone: () => void;
}) {
  const db = useSyncDb();
  const router = useRouter();
  const project = projects.find((p) => p.id === projectId) ?? projects[0];
  const units = unitSystemOf(project);
  const mixes = useLiveQuery(() => listByProject(db, "mix-designs", project.id), [db, project.id]);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<Values>({
    defaultValues: { element: "", level: "", grid: "", elementType: "slab-on-ground", leastDimension: "", plannedVolume: "", mixId: "", plannedStart: toLocalInput(new Date(), project.timeZone) },
  });
  useDirtyGuard("plan-placement", formState.isDirty);
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    try {
      const { id } = await createLocal(db, "placements", project.id, {
        element: v.element.trim(),
        level: v.level.trim() || undefined,
        grid: v.grid.trim() || undefined,
        elementType: v.elementType,
        leastDimensionMm: toSI("length", v.leastDimension, units),
        plannedVolumeM3: toSI("volume", v.plannedVolume, units),
        mixId: v.mixId || null,
        plannedStart: fromLocalInput(v.plannedStart, project.timeZone) ?? "",
      });
      onDone();
      router.push(`/field/placement?id=${id}`);
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      const map: Record<string, keyof Values> = { leastDimensionMm: "leastDimension", plannedVolumeM3: "plannedVolume" };
      for (const [key, text] of Object.entries(fields)) setError(map[key] ?? (key as keyof Values), { message: text });
      setFailure(message);
    }
  });

  return (
    <Section title="Plan a placement" testId="plan-placement-form">
      <form onSubmit={onSubmit} className="grid gap-3 sm:grid-cols-2" noValidate>
        {projects.length > 1 ? (
          <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800 sm:col-span-2">
            Project
            <select value={project.id} onChange={(e) => onProjectChange(e.target.value)} className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal">
              {projects.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <Field label="Element" placeholder="e.g. Level 2 deck, pour 3" error={errors.element?.message} data-testid="plan-element" {...register("element")} />
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
          Element type
          <select data-testid="plan-element-type" className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal" {...register("elementType")}>
            {ELEMENT_TYPES.map((t) => (
              <option key={t} value={t}>
                {ELEMENT_TYPE_LABELS[t]}
              </option>
            ))}
          </select>
        </label>
        <Field label="Level" error={errors.level?.message} data-testid="plan-level" {...register("level")} />
        <Field label="Grid" placeholder="e.g. C–F / 2–5" error={errors.grid?.message} data-testid="plan-grid" {...register("grid")} />
        <Field label="Least dimension" inputMode="decimal" unit={unitLabel("length", units)} error={errors.leastDimension?.message} data-testid="plan-least" {...register("leastDimension")} />
        <Field label="Planned volume" inputMode="decimal" unit={unitLabel("volume", units)} error={errors.plannedVolume?.message} data-testid="plan-volume" {...register("plannedVolume")} />
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
          Mix
          <select data-testid="plan-mix" className="min-h-touch rounded-lg border border-ink-300 bg-white px-3 text-base font-normal" {...register("mixId")}>
            <option value="">Not chosen yet</option>
            {(mixes ?? []).map((m) => (
              <option key={m.id} value={m.id}>
                {m.code}
                {m.supplier ? ` · ${m.supplier}` : ""}
              </option>
            ))}
          </select>
        </label>
        <Field label="Planned start" type="datetime-local" error={errors.plannedStart?.message} data-testid="plan-start" {...register("plannedStart")} />
        <FormFooter failure={failure} saveLabel="Save placement" saveTestId="plan-save" submitting={formState.isSubmitting} onCancel={onDone} />
      </form>
    </Section>
  );
}
