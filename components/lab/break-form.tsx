"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import type { UnitSystem } from "@/lib/concrete";
import { breakAgeDays } from "@/lib/lab/due";
import { breakDefaults, checkBreak, loadUnit, sizeUnit, type BreakFormValues, type SetForForm } from "./break-form-model";
import { localDateTimeToInstant } from "@/lib/time/zone";
import { strengthText } from "./format";

// ASTM C39 fracture patterns, recorded by number [memory: C39 figure].
const FRACTURE_TYPES = [
  [1, "Type 1: cones on both ends"],
  [2, "Type 2: cone on one end, vertical cracks"],
  [3, "Type 3: columnar vertical cracking"],
  [4, "Type 4: diagonal fracture"],
  [5, "Type 5: side fracture at the top or bottom"],
  [6, "Type 6: like 5, end pointed"],
] as const;

export type JudgeHint = { fcAgeDays: number; individualLimitMPa: number } | null;

/** Enter one break of a set; the strength appears as the numbers are typed. */
export function BreakForm({ projectId, set, unitSystem, timeZone, judge }: { projectId: string; set: SetForForm; unitSystem: UnitSystem; timeZone: string; judge: JudgeHint }) {
  const queryClient = useQueryClient();
  const [id, setId] = useState(() => crypto.randomUUID());
  const [message, setMessage] = useState<{ tone: "danger" | "success"; text: string } | null>(null);
  const resolver: Resolver<BreakFormValues> = async (values) => {
    const check = checkBreak(values, set, unitSystem, timeZone, id);
    if (check.ok) return { values, errors: {} };
    return { values: {}, errors: Object.fromEntries(Object.entries(check.errors).map(([f, text]) => [f, { type: "validate", message: text }])) };
  };
  const form = useForm<BreakFormValues>({ defaultValues: breakDefaults(set, unitSystem, timeZone), resolver });
  const values = useWatch({ control: form.control }) as BreakFormValues;
  const preview = checkBreak(values, set, unitSystem, timeZone, id);
  const testedAt = localDateTimeToInstant(values.testedAt, timeZone);
  const age = testedAt ? breakAgeDays(new Date(set.castAt), testedAt, set.testAgesDays) : null;
  const lowCylinder = judge && age === judge.fcAgeDays && preview.strengthMPa !== null && preview.strengthMPa < judge.individualLimitMPa;
  const e = form.formState.errors;

  const onSubmit = form.handleSubmit(async (v) => {
    setMessage(null);
    const check = checkBreak(v, set, unitSystem, timeZone, id);
    if (!check.ok) return;
    const res = await callApi(`/api/projects/${projectId}/records/breaks`, { body: check.body });
    if (!res.ok) {
      for (const [field, text] of Object.entries(res.error.fields ?? {})) {
        const key = ({ loadKN: "load", diameterMm: "diameter", lengthMm: "length", fractureType: "fractureType", testedAt: "testedAt", ageDays: "testedAt" } as const)[field as "loadKN"];
        if (key) form.setError(key, { message: text });
      }
      return setMessage({ tone: "danger", text: res.error.message });
    }
    setMessage({ tone: "success", text: `Break saved: ${strengthText(check.strengthMPa, unitSystem)} at ${check.body.ageDays} days.` });
    setId(crypto.randomUUID());
    form.reset({ ...v, load: "", fractureType: "" });
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: ["lab-sets", projectId] }),
      queryClient.invalidateQueries({ queryKey: ["lab-acceptance", projectId] }),
    ]);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="mt-3 rounded-lg border border-ink-200 bg-ink-50 p-3" data-testid="break-form">
      <p className="mb-2 font-semibold">Enter a break</p>
      <div className="grid gap-2 sm:grid-cols-3 lg:grid-cols-6">
        <Field label="Test time" type="datetime-local" error={e.testedAt?.message} className="lg:col-span-2" data-testid="break-tested-at" {...form.register("testedAt")} />
        <Field label="Maximum load" inputMode="decimal" unit={loadUnit(unitSystem)} error={e.load?.message} data-testid="break-load" {...form.register("load")} />
        <Field label="Diameter" inputMode="decimal" unit={sizeUnit(unitSystem)} error={e.diameter?.message} data-testid="break-diameter" {...form.register("diameter")} />
        <Field label="Length" inputMode="decimal" unit={sizeUnit(unitSystem)} hint="For the L/D correction" error={e.length?.message} data-testid="break-length" {...form.register("length")} />
        <Select label="Fracture type" error={e.fractureType?.message} data-testid="break-fracture" {...form.register("fractureType")}>
          <option value="">Not recorded</option>
          {FRACTURE_TYPES.map(([n, text]) => <option key={n} value={n}>{text}</option>)}
        </Select>
      </div>
      <div className="mt-2 flex flex-wrap items-center gap-x-6 gap-y-2 text-sm" aria-live="polite">
        <span>Age: <strong data-testid="break-age">{age === null ? "test time before cast time" : `${age} days`}</strong> (from the cast time)</span>
        <span>Strength: <strong className="font-mono text-base" data-testid="break-strength">{strengthText(preview.strengthMPa, unitSystem)}</strong> (ASTM C39, L/D-corrected)</span>
        <Button type="submit" disabled={form.formState.isSubmitting} className="ml-auto" data-testid="break-save">Save break</Button>
      </div>
      {lowCylinder ? (
        <Notice tone="caution" title="This cylinder is below the individual-test limit" className="mt-2" testId="break-low-preview">
          {strengthText(preview.strengthMPa, unitSystem)} is under {strengthText(judge!.individualLimitMPa, unitSystem)} (ACI 318-19 §26.12.3.1(b)). The strength test is the average of the set&apos;s cylinders at this age.
        </Notice>
      ) : null}
      {message ? <Notice tone={message.tone} title={message.text} className="mt-2" testId="break-message" /> : null}
    </form>
  );
}
