"use client";

// The signature of a record (a placement, an amendment, a site visit report): the person re-enters
// the password (checked by the server), types the name and draws the signature. The POST body is
// the sign-off schema of lib/signoff/schemas.ts: { baseVersion, password, typedName, signatureImage }.
// Signing needs a connection: offline the dialog says so and cannot be submitted.
import { Eraser, PenLine, WifiOff, X } from "lucide-react";
import { useEffect, useRef, useState } from "react";
import SignaturePad from "signature_pad";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { callApi, type ApiError } from "@/lib/api/client";
import { useOnline } from "@/lib/sync/client/react";
import type { Finding } from "@/lib/checks";
import { AcknowledgeFindings, unacknowledged } from "./acknowledge-findings";

export type SignOffDialogProps = {
  /** POST URL of the sign-off route. */
  endpoint: string;
  /** The version of the record the signer reviewed (the server refuses any other). */
  baseVersion: number;
  title: string;
  /** What is being signed, shown above the signature. */
  summary: React.ReactNode;
  open: boolean;
  onClose: () => void;
  onSigned: (result: unknown) => void;
  /** Why signing is not possible yet (known on the device: unsent changes …); shown and blocks submit. */
  blockedReason?: string | null;
  /** The rulebook's findings the signer must acknowledge one by one (placements); undefined while loading. */
  acknowledge?: { findings: Finding[] | undefined; error: string | null };
};

function useSignaturePad(open: boolean) {
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const padRef = useRef<SignaturePad | null>(null);
  const [empty, setEmpty] = useState(true);

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!open || !canvas) return;
    const pad = new SignaturePad(canvas, { penColor: "#0f1b2a", backgroundColor: "rgb(255,255,255)", minWidth: 1, maxWidth: 2.8 });
    padRef.current = pad;
    // Sized to its box in device pixels (capped so the PNG stays small); resizing clears it.
    const fit = () => {
      const ratio = Math.min(Math.max(window.devicePixelRatio || 1, 1), 2);
      canvas.width = canvas.offsetWidth * ratio;
      canvas.height = canvas.offsetHeight * ratio;
      canvas.getContext("2d")?.scale(ratio, ratio);
      pad.clear();
    };
    const refit = () => {
      // A phone's keyboard opening fires resize too: only a changed width redraws (and clears) the pad.
      const ratio = Math.min(Math.max(window.devicePixelRatio || 1, 1), 2);
      if (canvas.width === canvas.offsetWidth * ratio) return;
      fit();
      setEmpty(true);
    };
    fit();
    const onEnd = () => setEmpty(pad.isEmpty());
    pad.addEventListener("endStroke", onEnd);
    window.addEventListener("resize", refit);
    return () => {
      window.removeEventListener("resize", refit);
      pad.removeEventListener("endStroke", onEnd);
      pad.off();
      padRef.current = null;
    };
  }, [open]);

  const clear = () => {
    padRef.current?.clear();
    setEmpty(true);
  };
  const toPng = () => (padRef.current && !padRef.current.isEmpty() ? padRef.current.toDataURL("image/png") : "");
  return { canvasRef, empty, clear, toPng };
}

export function SignOffDialog(props: SignOffDialogProps) {
  // Mounted fresh on every opening, so no password or stroke survives a close.
  return props.open ? <DialogBody {...props} /> : null;
}

function DialogBody({ endpoint, baseVersion, title, summary, onClose, onSigned, blockedReason, acknowledge }: SignOffDialogProps) {
  const online = useOnline();
  const { canvasRef, empty, clear, toPng } = useSignaturePad(true);
  const [password, setPassword] = useState("");
  const [typedName, setTypedName] = useState("");
  const [error, setError] = useState<ApiError | null>(null);
  const [busy, setBusy] = useState(false);
  const [checked, setChecked] = useState<Set<string>>(() => new Set());
  const toggle = (key: string, on: boolean) =>
    setChecked((prev) => {
      const next = new Set(prev);
      if (on) next.add(key);
      else next.delete(key);
      return next;
    });
  const toAcknowledge = acknowledge ? unacknowledged(acknowledge.findings, checked) : [];
  const firstField = useRef<HTMLInputElement | null>(null);

  useEffect(() => {
    firstField.current?.focus();
  }, []);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => e.key === "Escape" && !busy && onClose();
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [busy, onClose]);

  const submit = async () => {
    setError(null);
    const signatureImage = toPng();
    if (!signatureImage) {
      setError({ code: "invalid_input", message: "Draw your signature in the box.", fields: { signatureImage: "Draw your signature in the box." } });
      return;
    }
    setBusy(true);
    const res = await callApi<unknown>(endpoint, { body: { baseVersion, password, typedName: typedName.trim(), signatureImage, ...(acknowledge ? { acknowledged: [...checked] } : {}) } });
    setBusy(false);
    if (res.ok) {
      setPassword("");
      clear();
      onSigned(res.data);
      return;
    }
    setError(res.error);
    if (res.error.code === "unauthenticated") setPassword("");
  };

  const cannot = !online ? "Signing needs a connection. Your records stay on this device; sign when you have signal." : (blockedReason ?? null);
  const fieldError = (name: string) => error?.fields?.[name];
  const titleOfError =
    error?.code === "unauthenticated" ? "Wrong password" : error?.code === "conflict" ? "Cannot sign yet" : error?.code === "forbidden" ? "Not allowed" : "Not signed";

  return (
    <div className="fixed inset-0 z-50 flex items-end justify-center bg-ink-950/60 sm:items-center sm:p-4" data-testid="sign-off-dialog-backdrop">
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby="sign-off-title"
        data-testid="sign-off-dialog"
        className="flex max-h-[100dvh] w-full max-w-xl flex-col overflow-hidden rounded-t-2xl bg-white shadow-xl sm:max-h-[92vh] sm:rounded-2xl"
      >
        <div className="flex items-center justify-between gap-2 border-b border-ink-200 px-4 py-3">
          <h2 id="sign-off-title" className="text-xl font-bold text-ink-950">
            {title}
          </h2>
          <Button variant="ghost" aria-label="Close" onClick={onClose} disabled={busy} className="px-2">
            <X className="h-6 w-6" aria-hidden="true" />
          </Button>
        </div>
        <form
          className="flex min-h-0 flex-1 flex-col"
          onSubmit={(e) => {
            e.preventDefault();
            void submit();
          }}
        >
          <div className="flex min-h-0 flex-1 flex-col gap-4 overflow-y-auto px-4 py-4">
          <div className="rounded-lg border border-ink-200 bg-ink-50 p-3">
            <p className="mb-1 text-sm font-bold uppercase tracking-wide text-ink-700">What you sign</p>
            {summary}
          </div>
          {acknowledge ? <AcknowledgeFindings findings={acknowledge.findings} error={acknowledge.error} checked={checked} onToggle={toggle} /> : null}
          <p className="text-sm text-ink-800">
            Once signed, the record is frozen: later changes are amendments shown beside it. The project specification and the engineer of record govern
            acceptance of the work.
          </p>
          {cannot ? (
            <Notice tone="caution" title={online ? "Not ready to sign" : "No connection"} testId="sign-off-blocked">
              <span className="inline-flex items-center gap-1">
                {!online ? <WifiOff className="h-4 w-4" aria-hidden="true" /> : null}
                {cannot}
              </span>
            </Notice>
          ) : null}
          <Field
            ref={firstField}
            label="Your password"
            type="password"
            autoComplete="current-password"
            value={password}
            onChange={(e) => setPassword(e.target.value)}
            error={fieldError("password")}
            data-testid="sign-off-password"
          />
          <Field
            label="Type your full name"
            autoComplete="name"
            value={typedName}
            onChange={(e) => setTypedName(e.target.value)}
            error={fieldError("typedName")}
            data-testid="sign-off-name"
          />
          <div className="flex flex-col gap-1">
            <div className="flex items-center justify-between">
              <span className="text-sm font-semibold text-ink-800" id="sign-off-pad-label">
                <PenLine className="mr-1 inline h-4 w-4" aria-hidden="true" />
                Draw your signature
              </span>
              <Button variant="ghost" onClick={clear} disabled={empty} data-testid="sign-off-clear" className="min-h-0 py-1 text-sm">
                <Eraser className="h-4 w-4" aria-hidden="true" /> Clear
              </Button>
            </div>
            <canvas
              ref={canvasRef}
              aria-labelledby="sign-off-pad-label"
              data-testid="sign-off-pad"
              data-empty={empty ? "yes" : "no"}
              className="h-40 w-full touch-none rounded-lg border-2 border-dashed border-ink-400 bg-white"
            />
            {fieldError("signatureImage") ? (
              <p className="text-sm font-medium text-danger-700" role="alert">
                {fieldError("signatureImage")}
              </p>
            ) : null}
          </div>
          {error && error.code !== "invalid_input" ? (
            <Notice tone="danger" title={titleOfError} testId="sign-off-error">
              {error.message}
            </Notice>
          ) : error && !error.fields ? (
            <Notice tone="danger" title="Not signed" testId="sign-off-error">
              {error.message}
            </Notice>
          ) : null}
          </div>
          {toAcknowledge && toAcknowledge.length > 0 ? (
            <p className="shrink-0 border-t border-ink-200 bg-caution-50 px-4 py-2 text-sm font-semibold text-caution-800" data-testid="acknowledge-remaining">
              Acknowledge {toAcknowledge.length === 1 ? "1 more finding" : `${toAcknowledge.length} more findings`} above to sign.
            </p>
          ) : null}
          <div className="flex shrink-0 gap-2 border-t border-ink-200 bg-white px-4 py-3">
            <Button type="submit" block disabled={busy || !!cannot || !password || typedName.trim().length < 2 || empty || toAcknowledge === null || toAcknowledge.length > 0} data-testid="sign-off-submit">
              {busy ? "Signing…" : "Sign"}
            </Button>
            <Button variant="secondary" onClick={onClose} disabled={busy}>
              Cancel
            </Button>
          </div>
        </form>
      </div>
    </div>
  );
}
