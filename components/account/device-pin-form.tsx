"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PIN_PATTERN, removeDevicePin, setDevicePin } from "@/lib/sync/client/device-access";
import { rememberIdentity } from "@/lib/sync/client/identity";
import { useOnline } from "@/lib/sync/client/react";

/**
 * A PIN for this device only: it opens the person's offline data after the offline window has
 * passed. Set while online and signed in (this page is served only to a live session).
 */
export function DevicePinForm({ user }: { user: { id: string; name: string; email: string; isAdmin: boolean } }) {
  const online = useOnline();
  const [pin, setPin] = useState("");
  const [repeat, setRepeat] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const save = async (e: React.FormEvent) => {
    e.preventDefault();
    setDone(null);
    if (!PIN_PATTERN.test(pin)) return setError("Use 4 to 8 digits for the PIN.");
    if (pin !== repeat) return setError("The two PINs differ. Type the same one twice.");
    setError(null);
    await rememberIdentity(user);
    await setDevicePin(user.id, pin);
    setPin("");
    setRepeat("");
    setDone("Device PIN saved on this device.");
  };
  return (
    <section className="card flex flex-col gap-3 p-4" aria-labelledby="pin-title">
      <h2 id="pin-title" className="text-lg font-bold">Device PIN</h2>
      <p className="text-muted">
        Opens your offline data on this device when your last sign-in here is older than the offline window. Only on this
        device; anyone who knows it can read what is kept here, so do not share it.
      </p>
      {done ? <Notice tone="success" title={done} testId="pin-result" /> : null}
      {!online ? <Notice tone="caution" title="Connect to set a PIN." /> : null}
      <form onSubmit={save} className="flex flex-col gap-3" noValidate>
        <Field label="PIN (4 to 8 digits)" type="password" inputMode="numeric" autoComplete="off" value={pin} onChange={(e) => setPin(e.target.value)} error={error ?? undefined} data-testid="pin-new" />
        <Field label="PIN again" type="password" inputMode="numeric" autoComplete="off" value={repeat} onChange={(e) => setRepeat(e.target.value)} data-testid="pin-repeat" />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={!online} data-testid="pin-save">Save PIN</Button>
          <Button variant="ghost" onClick={async () => { await removeDevicePin(user.id); setDone("Device PIN removed."); }}>Remove PIN</Button>
        </div>
      </form>
    </section>
  );
}
