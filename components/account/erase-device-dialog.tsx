"use client";

import { Trash2 } from "lucide-react";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { eraseAndSignOut, readUnsent, unsentWarning, type Unsent } from "@/lib/sync/client/erase";

/**
 * "Sign out and erase this device": says what is kept where, warns about what has not reached the
 * server, and refuses to erase it unless the person ticks that they accept losing it.
 */
export function EraseDeviceDialog({ userId, onClose }: { userId: string; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const [unsent, setUnsent] = useState<Unsent | null>(null);
  const [accept, setAccept] = useState(false);
  const [busy, setBusy] = useState(false);
  useEffect(() => {
    ref.current?.showModal();
    readUnsent(userId).then(setUnsent, () => setUnsent({ changes: 0, photos: 0 }));
  }, [userId]);
  const warning = unsent ? unsentWarning(unsent) : null;
  const blocked = unsent === null || (warning !== null && !accept);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="erase-title"
      data-testid="erase-dialog"
      className="w-[min(92vw,28rem)] rounded-xl p-0 text-ink-900 backdrop:bg-ink-950/50"
    >
      <div className="flex flex-col gap-3 p-5">
        <h2 id="erase-title" className="text-lg font-bold">Sign out and erase this device</h2>
        <p>
          Removes your records, photos and waiting changes from this phone or computer, and signs you out. Everything that
          reached the server stays there. Use it before handing the device to someone else.
        </p>
        {unsent === null ? <p className="text-muted">Checking what is waiting…</p> : null}
        {warning ? (
          <>
            <Notice tone="danger" title={warning} testId="erase-unsent">
              Connect and wait for the sync to finish first, or tick the box to erase anyway.
            </Notice>
            <label className="flex min-h-touch items-center gap-3 font-semibold">
              <input type="checkbox" className="h-6 w-6" checked={accept} onChange={(e) => setAccept(e.target.checked)} data-testid="erase-accept" />
              Erase anyway and lose what has not been sent
            </label>
          </>
        ) : unsent ? (
          <Notice tone="success" title="Nothing is waiting: everything has reached the server." testId="erase-all-sent" />
        ) : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={() => ref.current?.close()}>Cancel</Button>
          <Button
            variant="danger"
            disabled={blocked || busy}
            data-testid="erase-confirm"
            onClick={async () => {
              setBusy(true);
              await eraseAndSignOut(userId);
            }}
          >
            <Trash2 className="h-5 w-5" aria-hidden="true" /> Erase and sign out
          </Button>
        </div>
      </div>
    </dialog>
  );
}
