"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { DIGEST_HOURS, hourLabel } from "@/lib/digest/hours";
import { Table } from "@/components/ui/table";

export type RecipientItem = {
  id: string;
  email: string;
  name: string | null;
  source: "member" | "added";
  hourOverride: number | null;
  sendEmptyDays: boolean;
  status: "receiving" | "unsubscribed" | "no longer an owner";
  own: boolean;
};

type Result = { ok: true } | { ok: false; error: { message: string; fields?: Record<string, string> } };

const STATUS_TEXT: Record<RecipientItem["status"], string> = {
  receiving: "Receiving",
  unsubscribed: "Unsubscribed",
  "no longer an owner": "Not sent: no longer an owner",
};

export function DigestRecipients({
  projectId,
  digestHour,
  timeZone,
  recipients,
  readOnly = false,
}: {
  projectId: string;
  digestHour: number;
  timeZone: string;
  recipients: RecipientItem[];
  readOnly?: boolean;
}) {
  const router = useRouter();
  const base = `/api/projects/${projectId}/digest`;
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const [email, setEmail] = useState("");
  const [emailError, setEmailError] = useState<string | undefined>();
  const [newHour, setNewHour] = useState("");
  const [newEmptyDays, setNewEmptyDays] = useState(true);

  async function run(action: Promise<Result>, done: string) {
    setMessage(null);
    const result = await action;
    if (!result.ok) {
      setEmailError(result.error.fields?.email);
      return setMessage({ tone: "danger", text: result.error.message });
    }
    setEmailError(undefined);
    setMessage({ tone: "success", text: done });
    router.refresh();
  }
  const hourOptions = (defaultLabel: string) => [
    <option key="default" value="">{defaultLabel}</option>,
    ...DIGEST_HOURS.map((h) => <option key={h} value={h}>{hourLabel(h)}</option>),
  ];

  return (
    <section className="card flex flex-col gap-4 p-4" aria-labelledby="digest-recipients">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="digest-recipients" className="text-lg font-bold">Who receives it</h2>
        {readOnly ? null : (
          <Select
            label={`Project digest hour (${timeZone})`}
            defaultValue={digestHour}
            data-testid="project-hour"
            onChange={(e) => run(callApi(`${base}/settings`, { method: "PUT", body: { digestHour: Number(e.target.value) } }), `The digest now goes out at ${hourLabel(Number(e.target.value))}.`)}
          >
            {DIGEST_HOURS.map((h) => <option key={h} value={h}>{hourLabel(h)}</option>)}
          </Select>
        )}
      </div>
      {message ? <Notice tone={message.tone} title={message.text} testId="recipient-result" /> : null}
      <div className="overflow-x-auto">
        <Table columns={["Recipient", "Why", "Hour", "Days with no activity", "Status", !readOnly && { label: "Remove", hidden: true }]} testId="recipients-table">
            {recipients.length === 0 ? (
              <tr><td colSpan={6} className="px-3 py-3 text-muted">Nobody yet: the project has no owner and no added address.</td></tr>
            ) : (
              recipients.map((r) => (
                <tr key={r.id} data-testid="recipient-row">
                  <td className="px-3 py-2">
                    <span className="font-semibold">{r.name ?? r.email}</span>
                    {r.name ? <span className="block text-muted">{r.email}</span> : null}
                  </td>
                  <td className="px-3 py-2">{r.source === "member" ? "Owner of the project" : "Added by the office"}</td>
                  <td className="px-3 py-2">
                    {readOnly ? (
                      r.hourOverride === null ? `Project hour (${hourLabel(digestHour)})` : hourLabel(r.hourOverride)
                    ) : (
                      <>
                        <label className="sr-only" htmlFor={`hour-${r.id}`}>Hour for {r.email}</label>
                        <select
                          id={`hour-${r.id}`}
                          defaultValue={r.hourOverride ?? ""}
                          className="min-h-11 rounded-md border border-ink-300 bg-white px-2"
                          onChange={(e) => run(callApi(`${base}/recipients/${r.id}`, { method: "PATCH", body: { hourOverride: e.target.value === "" ? null : Number(e.target.value) } }), `Hour changed for ${r.email}.`)}
                        >
                          {hourOptions(`Project hour (${hourLabel(digestHour)})`)}
                        </select>
                      </>
                    )}
                  </td>
                  <td className="px-3 py-2">
                    {readOnly ? (
                      r.sendEmptyDays ? "One line: no placements" : "Nothing"
                    ) : (
                      <label className="inline-flex min-h-11 items-center gap-2">
                        <input
                          type="checkbox"
                          className="h-5 w-5 accent-lichen-700"
                          defaultChecked={r.sendEmptyDays}
                          onChange={(e) => run(callApi(`${base}/recipients/${r.id}`, { method: "PATCH", body: { sendEmptyDays: e.target.checked } }), `Empty-day setting changed for ${r.email}.`)}
                        />
                        Send “No placements today”
                      </label>
                    )}
                  </td>
                  <td className="px-3 py-2" data-testid="recipient-status">{STATUS_TEXT[r.status]}</td>
                  {readOnly ? null : (
                    <td className="px-3 py-2 text-right">
                      {r.source === "added" ? (
                        <Button variant="secondary" onClick={() => run(callApi(`${base}/recipients/${r.id}`, { method: "DELETE" }), `${r.email} was removed from the digest.`)}>
                          Remove
                        </Button>
                      ) : null}
                    </td>
                  )}
                </tr>
              ))
            )}
          </Table>
      </div>
      {readOnly ? null : (
        <form
          className="grid gap-3 border-t border-ink-100 pt-4 md:grid-cols-[1fr_12rem_auto_auto] md:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            const body = { email, hourOverride: newHour === "" ? null : Number(newHour), sendEmptyDays: newEmptyDays };
            void run(callApi(`${base}/recipients`, { body }), `${email} will receive the digest.`).then(() => setEmail(""));
          }}
        >
          <Field label="Add an e-mail address" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={emailError} required data-testid="add-recipient-email" />
          <Select label="Hour" value={newHour} onChange={(e) => setNewHour(e.target.value)}>
            {hourOptions(`Project hour (${hourLabel(digestHour)})`)}
          </Select>
          <label className="inline-flex min-h-touch items-center gap-2 text-sm font-semibold text-ink-800">
            <input type="checkbox" className="h-5 w-5 accent-lichen-700" checked={newEmptyDays} onChange={(e) => setNewEmptyDays(e.target.checked)} />
            Empty days too
          </label>
          <Button type="submit" data-testid="add-recipient">Add</Button>
        </form>
      )}
    </section>
  );
}
