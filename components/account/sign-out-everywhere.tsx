"use client";

import { signOut } from "next-auth/react";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";

/** Ends every session of the person (a lost phone, a shared computer), this one included. */
export function SignOutEverywhere() {
  const [error, setError] = useState<string | null>(null);
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="everywhere-title">
      <h2 id="everywhere-title" className="text-lg font-bold">Sign out everywhere</h2>
      <p className="text-muted">
        Ends your sessions on every browser and device, this one too. Changes waiting on a device stay there and are sent after
        you sign in on it again.
      </p>
      {error ? <Notice tone="danger" title={error} /> : null}
      <Button
        variant="secondary"
        data-testid="sign-out-everywhere"
        onClick={async () => {
          const result = await callApi("/api/account/sign-out-everywhere", { method: "POST" });
          if (!result.ok) return setError(result.error.message);
          await signOut({ callbackUrl: "/signin" });
        }}
      >
        Sign out everywhere
      </Button>
    </section>
  );
}
