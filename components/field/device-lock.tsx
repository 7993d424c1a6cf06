"use client";

// What the field screens show when the person remembered on this device may not open their offline
// data (lib/sync/client/device-access.ts): a PIN prompt, or a plain request to sign in that shows
// nothing of theirs.
import { KeyRound, LogIn } from "lucide-react";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import type { PinCheck } from "@/lib/sync/client/device-access";

export function SignInToOpen() {
  return (
    <div className="mx-auto mt-10 max-w-md card p-5 text-center" data-testid="field-locked">
      <LogIn className="mx-auto h-10 w-10 text-ink-600" aria-hidden="true" />
      <p className="mt-3 text-lg font-semibold text-ink-950">Sign in to open the data kept on this device.</p>
      <p className="mt-1 text-muted">
        The last sign-in here is too old to open it offline, and no device PIN was set. Sign in with a connection.
      </p>
      <Link href="/signin" className="mt-4 inline-flex min-h-touch items-center justify-center rounded-lg bg-lichen-700 px-5 font-semibold text-white">
        Sign in
      </Link>
    </div>
  );
}

export function PinUnlock({ name, unlock }: { name: string; unlock: (pin: string) => Promise<PinCheck> }) {
  const [pin, setPin] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setBusy(true);
    const result = await unlock(pin);
    setBusy(false);
    if (!result.ok) {
      setError(result.message);
      setPin("");
    }
  };
  return (
    <form onSubmit={submit} className="mx-auto mt-10 flex max-w-sm flex-col gap-3 card p-5" data-testid="field-pin" noValidate>
      <KeyRound className="mx-auto h-10 w-10 text-ink-600" aria-hidden="true" />
      <p className="text-center text-lg font-semibold text-ink-950">Enter the device PIN of {name}</p>
      <p className="text-center text-muted">This device was last signed in a while ago. The PIN opens the data kept here.</p>
      <Field
        label="Device PIN"
        type="password"
        inputMode="numeric"
        autoComplete="off"
        value={pin}
        onChange={(e) => setPin(e.target.value)}
        error={error ?? undefined}
        data-testid="field-pin-input"
      />
      <Button type="submit" disabled={busy || pin.length === 0} data-testid="field-pin-submit">Open</Button>
      <Link href="/signin" className="text-center font-semibold text-lichen-800 underline">Sign in instead</Link>
    </form>
  );
}
