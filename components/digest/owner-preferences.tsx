"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { DIGEST_HOURS, hourLabel } from "@/lib/digest/hours";
import type { RecipientItem } from "./digest-recipients";

/** An owner's own digest settings: hour, days with no activity, subscribed or not. */
export function OwnerPreferences({
  projectId,
  projectName,
  digestHour,
  timeZone,
  recipient,
}: {
  projectId: string;
  projectName: string;
  digestHour: number;
  timeZone: string;
  recipient: RecipientItem | null;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  if (!recipient) {
    return <Notice tone="info" title="You are not on this project's digest list." testId="owner-no-digest">Ask the project office to add your address.</Notice>;
  }
  const url = `/api/projects/${projectId}/digest/recipients/${recipient.id}`;
  async function change(body: Record<string, unknown>, done: string) {
    setMessage(null);
    const result = await callApi(url, { method: "PATCH", body });
    if (!result.ok) return setMessage({ tone: "danger", text: result.error.message });
    setMessage({ tone: "success", text: done });
    router.refresh();
  }
  const subscribed = recipient.status !== "unsubscribed";
  return (
    <section className="card flex max-w-xl flex-col gap-4 p-4" aria-labelledby="owner-digest">
      <h2 id="owner-digest" className="text-lg font-bold">Your daily digest</h2>
      <p className="text-ink-900">
        {subscribed ? (
          <>Each evening <strong>{recipient.email}</strong> receives one e-mail summarising the day on {projectName}.</>
        ) : (
          <><strong>{recipient.email}</strong> is unsubscribed from the {projectName} digest.</>
        )}
      </p>
      {message ? <Notice tone={message.tone} title={message.text} testId="owner-digest-result" /> : null}
      <Select
        label={`Send it at (${timeZone})`}
        defaultValue={recipient.hourOverride ?? ""}
        data-testid="owner-hour"
        onChange={(e) => change({ hourOverride: e.target.value === "" ? null : Number(e.target.value) }, "Your digest hour is saved.")}
      >
        <option value="">Project hour ({hourLabel(digestHour)})</option>
        {DIGEST_HOURS.map((h) => <option key={h} value={h}>{hourLabel(h)}</option>)}
      </Select>
      <label className="inline-flex min-h-touch items-center gap-3 text-base">
        <input
          type="checkbox"
          className="h-6 w-6 accent-lichen-700"
          defaultChecked={recipient.sendEmptyDays}
          data-testid="owner-empty-days"
          onChange={(e) => change({ sendEmptyDays: e.target.checked }, e.target.checked ? "You will get a one-line message on days with no activity." : "Nothing will be sent on days with no activity.")}
        />
        On days with no activity, send the line “No placements today”
      </label>
      <Button
        variant={subscribed ? "secondary" : "primary"}
        onClick={() => change({ subscribed: !subscribed }, subscribed ? "You are unsubscribed." : "You will receive the digest again.")}
        data-testid="owner-subscribe-toggle"
      >
        {subscribed ? "Unsubscribe" : "Receive the digest again"}
      </Button>
    </section>
  );
}
