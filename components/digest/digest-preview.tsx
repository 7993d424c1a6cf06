"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";

type Preview = { date: string; subject: string; html: string; isEmpty: boolean };
type SendReport = { sent: string[]; alreadySent: string[]; skippedEmpty: string[] };

function reportText(r: SendReport): string {
  const parts = [r.sent.length ? `Sent to ${r.sent.join(", ")}.` : "Nothing new was sent."];
  if (r.alreadySent.length) parts.push(`Already sent for this day: ${r.alreadySent.join(", ")}.`);
  if (r.skippedEmpty.length) parts.push(`Not sent (no activity, and they asked for nothing on such days): ${r.skippedEmpty.join(", ")}.`);
  return parts.join(" ");
}

/** Preview first, then "Send now" for exactly the day that was previewed. */
export function DigestPreview({ projectId, today }: { projectId: string; today: string }) {
  const router = useRouter();
  const base = `/api/projects/${projectId}/digest`;
  const [date, setDate] = useState(today);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [busy, setBusy] = useState(false);
  // "Send now" e-mails every recipient at once and cannot be taken back: it asks first.
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);

  async function load() {
    setBusy(true);
    setMessage(null);
    const result = await callApi<Omit<Preview, "date">>(`${base}/preview?date=${encodeURIComponent(date)}&format=json`);
    setBusy(false);
    if (!result.ok) return setMessage({ tone: "danger", text: result.error.message });
    setPreview({ ...result.data, date });
  }

  async function send() {
    if (!preview) return;
    setConfirming(false);
    setBusy(true);
    setMessage(null);
    const result = await callApi<SendReport>(`${base}/send`, { body: { date: preview.date } });
    setBusy(false);
    if (!result.ok) return setMessage({ tone: "danger", text: result.error.message });
    setMessage({ tone: "success", text: reportText(result.data) });
    router.refresh();
  }

  return (
    <section className="card flex flex-col gap-4 p-4" aria-labelledby="digest-preview">
      <h2 id="digest-preview" className="text-lg font-bold">Preview and send now</h2>
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          void load();
        }}
      >
        <Field label="Day" type="date" value={date} onChange={(e) => { setDate(e.target.value); setPreview(null); }} required className="w-52" data-testid="digest-date" />
        <Button type="submit" variant="secondary" disabled={busy || !date} data-testid="digest-preview-button">Preview</Button>
        <Button onClick={() => setConfirming(true)} disabled={busy || !preview || confirming} data-testid="digest-send-now" title={preview ? undefined : "Preview the day first"}>
          Send now
        </Button>
      </form>
      {confirming && preview ? (
        <div role="alertdialog" aria-labelledby="digest-confirm-text" className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-caution-600 bg-caution-50 p-3" data-testid="digest-send-confirm">
          <p id="digest-confirm-text" className="text-base font-semibold text-caution-800">
            Send the digest of {preview.date} now to everyone on the list who has not had it? An e-mail cannot be taken back.
          </p>
          <Button onClick={send} disabled={busy} data-testid="digest-send-confirm-yes">
            Yes, send it
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)} data-testid="digest-send-confirm-no">
            Cancel
          </Button>
        </div>
      ) : null}
      {message ? <Notice tone={message.tone} title={message.text} testId="digest-send-result" /> : null}
      {preview ? (
        <div className="flex flex-col gap-2">
          <p className="text-sm text-muted">
            Subject: <span className="font-semibold text-ink-900" data-testid="digest-subject">{preview.subject}</span>
          </p>
          <iframe
            title={`Digest preview for ${preview.date}`}
            srcDoc={preview.html.replace("<head>", '<head><base target="_blank">')}
            sandbox="allow-popups allow-popups-to-escape-sandbox"
            className="h-[44rem] w-full rounded-lg border border-ink-200 bg-white"
            data-testid="digest-preview-frame"
          />
        </div>
      ) : (
        <p className="text-sm text-muted">Preview a day to see the e-mail as recipients will get it; Send now sends that day to everyone who has not had it yet.</p>
      )}
    </section>
  );
}
