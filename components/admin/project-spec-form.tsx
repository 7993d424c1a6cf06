"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { COLD_WEATHER_LIMITS, type UnitSystem } from "@/lib/concrete";
import {
  projectSpecSchema,
  specChange,
  specDefaults,
  specFormValues,
  specUnit,
  type ProjectSpec,
  type SpecField,
  type SpecFormValues,
} from "@/lib/projects/spec";

const unitSign = (unitSystem: UnitSystem) => (unitSystem === "SI" ? "°C" : "°F");

/** The project specification's values for the rulebook, in the project's units. */
export function ProjectSpecForm({ projectId, unitSystem, spec }: { projectId: string; unitSystem: UnitSystem; spec: ProjectSpec }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const schema = projectSpecSchema(unitSystem);
  const initial = specFormValues(spec, unitSystem);
  // Only the changed fields are checked and sent, so a value shown rounded is never rewritten.
  const changed = (values: SpecFormValues) => (Object.keys(values) as SpecField[]).filter((f) => values[f] !== initial[f]);
  const resolver: Resolver<SpecFormValues> = async (values) => {
    const result = schema.safeParse(specChange(values, changed(values), unitSystem));
    const issues = result.success ? [] : result.error.issues.filter((i) => i.path.length > 0);
    if (issues.length === 0) return { values, errors: {} };
    return { values: {}, errors: Object.fromEntries(issues.map((i) => [i.path[0], { type: "validate", message: i.message }])) };
  };
  const form = useForm<SpecFormValues>({ defaultValues: initial, resolver });
  const e = form.formState.errors;
  const defaults = specDefaults(unitSystem);
  const cold = (d: keyof typeof COLD_WEATHER_LIMITS) => `${COLD_WEATHER_LIMITS[d][unitSystem].below} ${unitSign(unitSystem)}`;
  const number = (field: SpecField) => ({ ...form.register(field), inputMode: "decimal" as const, unit: specUnit(field, unitSystem), error: e[field]?.message });

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    const fields = changed(values);
    if (fields.length === 0) return setMessage({ tone: "danger", text: "Nothing has changed." });
    const result = await callApi<ProjectSpec>(`/api/admin/projects/${projectId}`, { method: "PATCH", body: specChange(values, fields, unitSystem) });
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.error.fields ?? {})) form.setError(field as SpecField, { message: text });
      return setMessage({ tone: "danger", text: result.error.message });
    }
    form.reset(specFormValues(result.data, unitSystem));
    setMessage({ tone: "success", text: "Saved. Every record of the project has been checked again with these values." });
    router.refresh();
  });

  return (
    <section className="card flex max-w-3xl flex-col gap-4 p-4" aria-labelledby="project-spec">
      <div>
        <h2 id="project-spec" className="text-lg font-bold">Project specification</h2>
        <p className="text-sm text-muted">
          The checks use the published limits unless the project specification sets its own. Take these values from the
          specification and the engineer of record; a change re-checks every record of the project, signed ones included,
          and the audit trail keeps the old values.
        </p>
      </div>
      {message ? <Notice tone={message.tone} title={message.text} testId="project-spec-result" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-5" noValidate data-testid="project-spec-form">
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-muted">Placing limits</legend>
          <Field label="Evaporation limit" hint={`Blank: ${defaults.evaporation}`} {...number("evaporationHighKgM2H")} />
          <Field label="Maximum concrete temperature" {...number("maxConcreteTempC")} />
          <Field label="Discharge time limit" hint="From batching to the end of discharge (ASTM C94: 90 min unless the purchaser sets another)" {...number("dischargeLimitMinutes")} />
          <Field label="Drum revolution limit" hint="Blank unless the order states one" {...number("revolutionLimit")} />
          <Select label="Cold weather" error={e.coldWeatherDefinition?.message} {...form.register("coldWeatherDefinition")}>
            <option value="aci306r-current">ACI 306R (current): air at or below {cold("aci306r-current")}</option>
            <option value="aci306-1990">ACI 306.1-90: daily mean below {cold("aci306-1990")} for 3 days</option>
          </Select>
          <Field label="Editions cited" hint="e.g. ACI 318-19, ACI 301-20" error={e.specEditions?.message} {...form.register("specEditions")} />
        </fieldset>
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-muted">Maturity method (ASTM C1074)</legend>
          <Select label="Method" error={e.maturityMethod?.message} {...form.register("maturityMethod")}>
            <option value="nurse-saul">Temperature-time factor (Nurse-Saul)</option>
            <option value="equivalent-age">Equivalent age (Arrhenius)</option>
          </Select>
          <Field label="Datum temperature" hint={`Nurse-Saul; C1074 default ${defaults.datum}`} {...number("maturityDatumC")} />
          <Field label="Activation energy" hint={`Equivalent age; C1074 default ${defaults.activationEnergy}`} {...number("maturityActivationEnergyJPerMol")} />
          <Field label="Target strength" hint="For stripping or stressing, when the specification sets one" {...number("maturityTargetMPa")} />
        </fieldset>
        <Button type="submit" disabled={form.formState.isSubmitting} className="self-start">Save specification</Button>
      </form>
    </section>
  );
}
