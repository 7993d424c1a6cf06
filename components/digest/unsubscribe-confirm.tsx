"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";

export function UnsubscribeConfirm({ token, email, projectName, alreadyUnsubscribed }: { token: string; email: string; projectName: string; alreadyUnsubscribed: boolean }) {
  const [done, setDone] = useState(alreadyUnsubscribed);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (done) {
    return (
      <Notice tone="success" title="You are unsubscribed." testId="unsubscribe-done">
        {email} no longer receives the daily digest of {projectName}. To receive it again, owners can turn it back on from the digest page in Placewright; anyone else can ask the project office.
      </Notice>
    );
  }
  async function confirm() {
    setBusy(true);
    setError(null);
    const result = await callApi(`/api/digest/unsubscribe?token=${encodeURIComponent(token)}`, { method: "POST" });
    setBusy(false);
    if (result.ok) setDone(true);
    else setError(result.error.message);
  }
  return (
    <>
      <p className="text-ink-900">
        Stop sending the daily digest of <strong>{projectName}</strong> to <strong>{email}</strong>?
      </p>
      {error ? <Notice tone="danger" title={error} /> : null}
      <Button onClick={confirm} disabled={busy} block data-testid="unsubscribe-confirm">
        {busy ? "Unsubscribing…" : "Unsubscribe"}
      </Button>
    </>
  );
}
