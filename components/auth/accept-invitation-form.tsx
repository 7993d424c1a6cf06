"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { acceptInvitationSchema } from "@/lib/users/schemas";

const formSchema = acceptInvitationSchema
  .pick({ password: true })
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: "The two passwords are different.", path: ["confirm"] });

export function AcceptInvitationForm({ token, email, name }: { token: string; email: string; name: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<z.infer<typeof formSchema>>({ resolver: zodResolver(formSchema) });

  const onSubmit = form.handleSubmit(async ({ password }) => {
    setError(null);
    const res = await fetch("/api/invitations/accept", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ token, password }),
    }).catch(() => null);
    if (!res) return setError("No connection. Try again when you have signal.");
    if (!res.ok) {
      const body = await res.json().catch(() => null);
      return setError(body?.error?.message ?? "The password could not be saved.");
    }
    const result = await signIn("password", { email, password, redirect: false });
    if (result?.error) return setError(result.error);
    router.replace("/today");
    router.refresh();
  });

  return (
    <section className="card flex flex-col gap-4 p-5">
      <h1 className="text-xl font-bold">Welcome, {name}</h1>
      <p className="text-muted">
        Choose a password for <strong className="text-ink-900">{email}</strong>.
      </p>
      {error ? <Notice tone="danger" title={error} testId="invite-error" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
        <Field label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={form.formState.errors.password?.message} {...form.register("password")} />
        <Field label="Repeat the password" type="password" autoComplete="new-password" error={form.formState.errors.confirm?.message} {...form.register("confirm")} />
        <Button type="submit" block disabled={form.formState.isSubmitting}>
          Save password and sign in
        </Button>
      </form>
    </section>
  );
}
