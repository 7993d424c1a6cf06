"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { accountSettingsSchema } from "@/lib/users/schemas";

type Values = z.input<typeof accountSettingsSchema>;

/** The idle limit of sessions and the offline window of devices, for everyone. */
export function AccountSettingsForm({ initial }: { initial: { idleTimeoutMinutes: number; offlineWindowHours: number } }) {
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(accountSettingsSchema), defaultValues: initial });
  const onSubmit = form.handleSubmit(async (v) => {
    const result = await callApi("/api/admin/settings", { method: "PUT", body: v });
    setMessage(result.ok ? { tone: "success", text: "Saved. It applies to every session from its next request." } : { tone: "danger", text: result.error.message });
  });
  const e = form.formState.errors;
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="sessions-title">
      <h2 id="sessions-title" className="text-lg font-bold">Sessions and devices</h2>
      {message ? <Notice tone={message.tone} title={message.text} testId="settings-result" /> : null}
      <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
        <Field label="Sign out after no use for" unit="min" inputMode="numeric" hint="15 to 43,200 minutes." error={e.idleTimeoutMinutes?.message} {...form.register("idleTimeoutMinutes")} />
        <Field
          label="Open offline data without a PIN for"
          unit="h"
          inputMode="numeric"
          hint="After this long without a good sign-in, a device asks for the person's PIN or a sign-in."
          error={e.offlineWindowHours?.message}
          {...form.register("offlineWindowHours")}
        />
        <Button type="submit" disabled={form.formState.isSubmitting}>Save</Button>
      </form>
    </section>
  );
}
