"use client";

// The amendments beside a signed placement: each one's text, author and signature (signable by a
// role that writes amendments), and the form that adds one. Read from and written to the server.
import { useQueryClient } from "@tanstack/react-query";
import { FilePenLine } from "lucide-react";
import { useState } from "react";
import { mayWrite } from "@/components/field/field-project";
import { formatDateTime } from "@/components/field/project-time";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import type { ProjectRow } from "@/lib/sync/client";
import { SignOffDialog } from "./lazy-sign-off-dialog";
import { SignatureBlock } from "./signature-block";
import { amendmentsUrl, type AmendmentRow } from "./use-sign-off";

export function AmendmentCard({ amendment, project, placementId }: { amendment: AmendmentRow; project: ProjectRow; placementId: string }) {
  const [signing, setSigning] = useState(false);
  const queryClient = useQueryClient();
  const canSign = mayWrite(project, "amendment.write") && !amendment.signOff;
  return (
    <li className="rounded-lg border-2 border-ink-200 bg-white p-3" data-testid="amendment">
      <p className="text-sm text-muted">
        {amendment.authorName ?? "Someone"} · {formatDateTime(amendment.createdAt, project.timeZone)}
      </p>
      <p className="mt-1 text-base">
        <span className="font-semibold">What changes:</span> <span data-testid="amendment-what">{amendment.what}</span>
      </p>
      <p className="mt-1 text-base">
        <span className="font-semibold">Why:</span> {amendment.why}
      </p>
      {amendment.signOff ? (
        <div className="mt-2 border-t border-ink-100 pt-2" data-testid="amendment-signed">
          <SignatureBlock signOff={amendment.signOff} timeZone={project.timeZone} />
          {amendment.matches === false ? (
            <Notice tone="danger" title="This amendment changed after it was signed" className="mt-2" />
          ) : (
            <p className="mt-1 text-sm text-lichen-800">Signed amendment; its text matches the signature.</p>
          )}
        </div>
      ) : (
        <p className="mt-2 text-sm text-muted">Not signed.</p>
      )}
      {canSign ? (
        <Button variant="secondary" className="mt-2" data-testid="sign-amendment" onClick={() => setSigning(true)}>
          <FilePenLine className="h-5 w-5" aria-hidden="true" /> Sign this amendment
        </Button>
      ) : null}
      <SignOffDialog
        open={signing}
        endpoint={`${amendmentsUrl(project.id, placementId)}/${amendment.id}/sign-off`}
        baseVersion={amendment.version}
        title="Sign the amendment"
        summary={
          <p className="text-base">
            {amendment.what} <span className="text-muted">— {amendment.why}</span>
          </p>
        }
        onClose={() => setSigning(false)}
        onSigned={() => {
          setSigning(false);
          void queryClient.invalidateQueries({ queryKey: ["sign-off", project.id, placementId] });
        }}
      />
    </li>
  );
}

export function AmendmentForm({ project, placementId, onDone }: { project: ProjectRow; placementId: string; onDone: () => void }) {
  const [what, setWhat] = useState("");
  const [why, setWhy] = useState("");
  const [error, setError] = useState<{ message: string; fields?: Record<string, string> } | null>(null);
  const [busy, setBusy] = useState(false);
  const queryClient = useQueryClient();
  const submit = async () => {
    setBusy(true);
    setError(null);
    const res = await callApi(amendmentsUrl(project.id, placementId), { body: { id: crypto.randomUUID(), what: what.trim(), why: why.trim() } });
    setBusy(false);
    if (!res.ok) return setError(res.error);
    await queryClient.invalidateQueries({ queryKey: ["sign-off", project.id, placementId] });
    onDone();
  };
  const area = "min-h-24 w-full rounded-lg border border-ink-300 bg-white p-3 text-base";
  return (
    <form
      className="mt-3 flex flex-col gap-3 rounded-lg border border-ink-200 bg-ink-50 p-3"
      data-testid="amendment-form"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <label className="text-sm font-semibold text-ink-800">
        What changes
        <textarea className={area} value={what} onChange={(e) => setWhat(e.target.value)} data-testid="amendment-what-input" />
        {error?.fields?.what ? <span className="text-danger-700">{error.fields.what}</span> : null}
      </label>
      <label className="text-sm font-semibold text-ink-800">
        Why
        <textarea className={area} value={why} onChange={(e) => setWhy(e.target.value)} data-testid="amendment-why-input" />
        {error?.fields?.why ? <span className="text-danger-700">{error.fields.why}</span> : null}
      </label>
      {error && !error.fields ? <Notice tone="danger" title="Not added">{error.message}</Notice> : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={busy || what.trim().length < 3 || why.trim().length < 3} data-testid="amendment-save">
          Add the amendment
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
