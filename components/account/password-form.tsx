"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { changePasswordSchema } from "@/lib/users/schemas";

const formSchema = changePasswordSchema
  .extend({ repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { message: "The two new passwords differ. Type the same one twice.", path: ["repeat"] });

/** Set a first password (people who came in by e-mailed link need one to sign off) or change it. */
export function PasswordForm({ hasPassword }: { hasPassword: boolean }) {
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const form = useForm<z.infer<typeof formSchema>>({ resolver: zodResolver(formSchema), defaultValues: { currentPassword: "", newPassword: "", repeat: "" } });
  const onSubmit = form.handleSubmit(async (v) => {
    setMessage(null);
    const result = await callApi("/api/account/password", { body: { ...(hasPassword ? { currentPassword: v.currentPassword } : {}), newPassword: v.newPassword } });
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.error.fields ?? {})) {
        if (field in v) form.setError(field as keyof typeof v, { message: text });
      }
      return setMessage({ tone: "danger", text: result.error.message });
    }
    form.reset();
    setMessage({ tone: "success", text: "Password saved. You stay signed in here; every other browser and device is signed out." });
  });
  const e = form.formState.errors;
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="password-title">
      <h2 id="password-title" className="text-lg font-bold">{hasPassword ? "Change your password" : "Set a password"}</h2>
      {hasPassword ? null : (
        <p className="text-muted">You came in with an e-mailed link. A password lets you sign in without one and is needed to sign off records.</p>
      )}
      {message ? <Notice tone={message.tone} title={message.text} testId="password-result" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
        {hasPassword ? (
          <Field label="Current password" type="password" autoComplete="current-password" error={e.currentPassword?.message} {...form.register("currentPassword")} />
        ) : null}
        <Field label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={e.newPassword?.message} {...form.register("newPassword")} />
        <Field label="New password again" type="password" autoComplete="new-password" error={e.repeat?.message} {...form.register("repeat")} />
        <Button type="submit" disabled={form.formState.isSubmitting} data-testid="password-save">Save password</Button>
      </form>
    </section>
  );
}
