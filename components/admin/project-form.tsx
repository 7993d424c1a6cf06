"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { projectSchema } from "@/lib/projects/schemas";
import { deviceTimeZone } from "@/lib/time/zone";

type FormIn = z.input<typeof projectSchema>;

export function ProjectForm() {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const form = useForm<FormIn>({
    resolver: zodResolver(projectSchema),
    defaultValues: { timeZone: deviceTimeZone(), unitSystem: "IP", siteAddress: "" },
  });

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    const result = await callApi<{ name: string }>("/api/admin/projects", { body: values });
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.error.fields ?? {})) form.setError(field as keyof FormIn, { message: text });
      return setMessage({ tone: "danger", text: result.error.message });
    }
    setMessage({ tone: "success", text: `Project ${result.data.name} created.` });
    form.reset();
    router.refresh();
  });

  const e = form.formState.errors;
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="new-project">
      <h2 id="new-project" className="text-lg font-bold">New project</h2>
      {message ? <Notice tone={message.tone} title={message.text} testId="project-result" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
        <Field label="Name" error={e.name?.message} {...form.register("name")} />
        <Field label="Code" hint="Short, e.g. LC-02" error={e.code?.message} {...form.register("code")} />
        <Field label="Site address" error={e.siteAddress?.message} {...form.register("siteAddress")} />
        <Field label="Time zone" hint="Where the site is, e.g. America/Chicago" error={e.timeZone?.message} {...form.register("timeZone")} />
        <Select label="Units" error={e.unitSystem?.message} {...form.register("unitSystem")}>
          <option value="IP">Inch-pound (°F, in, yd³, psi)</option>
          <option value="SI">SI (°C, mm, m³, MPa)</option>
        </Select>
        <Button type="submit" disabled={form.formState.isSubmitting}>Create project</Button>
      </form>
    </section>
  );
}
