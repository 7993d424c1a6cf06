"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import type { UnitSystem } from "@/lib/concrete/units";
import { checkMixForm, formDefaults, localiseMessage, unitFor, type MixFormValues } from "@/lib/mixes/form";
import type { MixDesignValues } from "@/lib/records/schemas/mix-design";

type ExistingMix = MixDesignValues & { version: number };

/** Create or edit a mix design in the project's units; the shared mix schema checks it. */
export function MixForm({ projectId, unitSystem, mix }: { projectId: string; unitSystem: UnitSystem; mix?: ExistingMix }) {
  const router = useRouter();
  const [id] = useState(() => mix?.id ?? crypto.randomUUID());
  const [message, setMessage] = useState<string | null>(null);
  const resolver: Resolver<MixFormValues> = async (values) => {
    const check = checkMixForm(values, unitSystem, id);
    if (check.ok) return { values, errors: {} };
    const errors = Object.fromEntries(Object.entries(check.errors).map(([field, text]) => [field, { type: "validate", message: text }]));
    return { values: {}, errors };
  };
  const form = useForm<MixFormValues>({ defaultValues: formDefaults(mix ?? null, unitSystem), resolver });
  const e = form.formState.errors;
  const unit = (field: Parameters<typeof unitFor>[0]) => unitFor(field, unitSystem);

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    const check = checkMixForm(values, unitSystem, id);
    if (!check.ok) return;
    const base = `/api/projects/${projectId}/records/mix-designs`;
    let result;
    if (mix) {
      // Only what was touched is sent, so a value shown rounded in inch-pound units is not rewritten.
      const changed = Object.keys(form.formState.dirtyFields) as (keyof MixDesignValues)[];
      if (changed.length === 0) return setMessage("Nothing has changed.");
      const patch = Object.fromEntries(changed.map((field) => [field, check.values[field] ?? null]));
      result = await callApi(`${base}/${mix.id}`, { method: "PATCH", body: { baseVersion: mix.version, patch } });
    } else {
      result = await callApi(base, { body: check.values });
    }
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.error.fields ?? {})) {
        form.setError(field as keyof MixFormValues, { message: localiseMessage(field, text, unitSystem) });
      }
      return setMessage(result.error.message);
    }
    router.push(`/projects/${projectId}/mixes`);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} className="card flex max-w-3xl flex-col gap-5 p-4" noValidate data-testid="mix-form">
      {message ? <Notice tone="danger" title={message} testId="mix-form-message" /> : null}
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-bold">Mix</legend>
        <Field label="Mix code" hint="As on the supplier's submittal, e.g. LC-4000-A" error={e.code?.message} {...form.register("code")} />
        <Field label="Supplier" error={e.supplier?.message} {...form.register("supplier")} />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Strength</legend>
        <Field label="Specified strength f′c" inputMode="decimal" unit={unit("fcMPa")} error={e.fcMPa?.message} {...form.register("fcMPa")} />
        <Select label="At age" error={e.fcAgeDays?.message} {...form.register("fcAgeDays")}>
          <option value="28">28 days</option>
          <option value="56">56 days</option>
        </Select>
        <Field label="Maximum w/cm" inputMode="decimal" hint="Water to cementitious materials, e.g. 0.45" error={e.maxWcm?.message} {...form.register("maxWcm")} />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Slump and air</legend>
        <Field label="Slump" inputMode="decimal" unit={unit("slumpTargetMm")} error={e.slumpTargetMm?.message} {...form.register("slumpTargetMm")} />
        <Select label="Slump is" error={e.slumpType?.message} {...form.register("slumpType")}>
          <option value="target">a target (± tolerance)</option>
          <option value="maximum">a maximum (not to exceed)</option>
        </Select>
        <Field label="Slump tolerance" inputMode="decimal" unit={unit("slumpToleranceMm")} hint="Empty: the ASTM C94 default" error={e.slumpToleranceMm?.message} {...form.register("slumpToleranceMm")} />
        <Field label="Air content" inputMode="decimal" unit="%" hint="Empty when not air-entrained" error={e.airTargetPct?.message} {...form.register("airTargetPct")} />
        <Field label="Air tolerance" inputMode="decimal" unit="%" hint="Empty: ±1.5 points (ASTM C94)" error={e.airTolerancePct?.message} {...form.register("airTolerancePct")} />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-bold">Temperature and water at site</legend>
        <Field label="Maximum concrete temperature" inputMode="decimal" unit={unit("maxConcreteTempC")} hint="Empty: the project's limit" error={e.maxConcreteTempC?.message} {...form.register("maxConcreteTempC")} />
        <Field label="Water that may be added at site" inputMode="decimal" unit={unit("siteWaterAllowedLPerM3")} hint="Withheld water from the ticket; 0 if none" error={e.siteWaterAllowedLPerM3?.message} {...form.register("siteWaterAllowedLPerM3")} />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-bold">Materials</legend>
        <Field label="Cement type" hint="e.g. Type I/II, GU" error={e.cementType?.message} {...form.register("cementType")} />
        <Field label="Supplementary materials" hint="e.g. 20 % Class F fly ash" error={e.scms?.message} {...form.register("scms")} />
        <label className="flex min-h-touch items-center gap-3 text-base font-semibold text-ink-800 sm:col-span-2">
          <input type="checkbox" className="h-6 w-6 accent-lichen-700" {...form.register("lowBleed")} />
          Low-bleed mix (silica fume or low w/cm): evaporation warnings start at half the usual rate
        </label>
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={form.formState.isSubmitting} data-testid="mix-save">{mix ? "Save changes" : "Add mix"}</Button>
        <Button variant="secondary" onClick={() => router.push(`/projects/${projectId}/mixes`)}>Cancel</Button>
      </div>
    </form>
  );
}
