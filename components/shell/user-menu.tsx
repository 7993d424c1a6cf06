"use client";

import { LogOut, Trash2, UserRound } from "lucide-react";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { EraseDeviceDialog } from "@/components/account/erase-device-dialog";
import { useSignOutWithCheck } from "@/lib/sync/client/react";
import type { ShellUser } from "./shell-user";

export function UserMenu({ user, offline = false }: { user: ShellUser; offline?: boolean }) {
  const [open, setOpen] = useState(false);
  const [erasing, setErasing] = useState(false);
  const ref = useRef<HTMLDivElement>(null);
  const signOut = useSignOutWithCheck();
  useEffect(() => {
    if (!open) return;
    const close = (e: MouseEvent) => ref.current && !ref.current.contains(e.target as Node) && setOpen(false);
    document.addEventListener("mousedown", close);
    return () => document.removeEventListener("mousedown", close);
  }, [open]);

  return (
    <div className="relative" ref={ref}>
      <button
        type="button"
        aria-expanded={open}
        aria-haspopup="menu"
        // On a phone the name is hidden: the button still says whose menu it is.
        aria-label={`Account menu: ${user.name}`}
        onClick={() => setOpen((o) => !o)}
        data-testid="user-menu"
        className="inline-flex min-h-11 min-w-11 items-center justify-center gap-2 rounded-md px-2 text-sm font-semibold text-white hover:bg-white/10"
      >
        <UserRound className="h-5 w-5" aria-hidden="true" />
        <span className="hidden max-w-[10rem] truncate lg:inline">{user.name}</span>
      </button>
      {open ? (
        <div role="menu" className="absolute right-0 mt-2 w-64 rounded-lg border border-ink-200 bg-white p-2 text-ink-900 shadow-lg">
          <p className="px-2 pt-1 font-semibold" data-testid="signed-in-name">{user.name}</p>
          <p className="truncate px-2 pb-2 text-sm text-muted">{user.email}</p>
          {offline ? <p className="px-2 pb-2 text-sm text-muted">Working from this device (offline).</p> : null}
          <button
            type="button"
            role="menuitem"
            onClick={() => void signOut({ callbackUrl: "/signin" })}
            className="flex min-h-touch w-full items-center gap-2 rounded-md px-2 text-left font-semibold hover:bg-ink-100"
          >
            <LogOut className="h-5 w-5" aria-hidden="true" /> Sign out
          </button>
          <button
            type="button"
            role="menuitem"
            data-testid="erase-device"
            onClick={() => {
              setOpen(false);
              setErasing(true);
            }}
            className="flex min-h-touch w-full items-center gap-2 rounded-md px-2 text-left font-semibold text-danger-800 hover:bg-ink-100"
          >
            <Trash2 className="h-5 w-5" aria-hidden="true" /> Sign out and erase this device
          </button>
          {offline ? null : (
            <Link role="menuitem" href="/account" className="flex min-h-touch w-full items-center gap-2 rounded-md px-2 font-semibold hover:bg-ink-100" data-testid="account-link">
              <UserRound className="h-5 w-5" aria-hidden="true" /> Password, sessions and device PIN
            </Link>
          )}
        </div>
      ) : null}
      {erasing ? <EraseDeviceDialog userId={user.id} onClose={() => setErasing(false)} /> : null}
    </div>
  );
}
