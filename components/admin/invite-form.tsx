"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { PROJECT_ROLES, ROLE_LABELS } from "@/lib/auth/roles";
import { emailField, nameField } from "@/lib/users/schemas";

const formSchema = z.object({ email: emailField, name: nameField, projectId: z.string(), role: z.string() });

export function InviteForm({ projects }: { projects: { id: string; name: string }[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const form = useForm<z.infer<typeof formSchema>>({ resolver: zodResolver(formSchema), defaultValues: { projectId: "", role: "" } });

  const onSubmit = form.handleSubmit(async (v) => {
    setMessage(null);
    const result = await callApi("/api/invitations", {
      body: { email: v.email, name: v.name, ...(v.projectId ? { projectId: v.projectId } : {}), ...(v.role ? { role: v.role } : {}) },
    });
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.error.fields ?? {})) {
        if (field in v) form.setError(field as keyof typeof v, { message: text });
      }
      return setMessage({ tone: "danger", text: result.error.message });
    }
    setMessage({ tone: "success", text: `Invitation sent to ${v.email}.` });
    form.reset({ email: "", name: "", projectId: "", role: "" });
    router.refresh();
  });

  const e = form.formState.errors;
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="invite-title">
      <h2 id="invite-title" className="text-lg font-bold">Invite someone</h2>
      {message ? <Notice tone={message.tone} title={message.text} testId="invite-result" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
        <Field label="Name" autoComplete="off" error={e.name?.message} {...form.register("name")} />
        <Field label="E-mail" type="email" autoComplete="off" error={e.email?.message} {...form.register("email")} />
        <Select label="Project (optional)" error={e.projectId?.message} {...form.register("projectId")}>
          <option value="">No project yet</option>
          {projects.map((p) => (
            <option key={p.id} value={p.id}>{p.name}</option>
          ))}
        </Select>
        <Select label="Role on that project" error={e.role?.message} {...form.register("role")}>
          <option value="">No role</option>
          {PROJECT_ROLES.map((r) => (
            <option key={r} value={r}>{ROLE_LABELS[r]}</option>
          ))}
        </Select>
        <Button type="submit" disabled={form.formState.isSubmitting}>Send invitation</Button>
      </form>
    </section>
  );
}
