"use client";

// The shell of the offline field screens: who is using the device (the session when online, the
// device's copy otherwise), the sync loop, a project switcher from the device database, and the
// bottom navigation. Rendered by the static (field) layout, so it never asks the server for anything.
import { BottomNav } from "@/components/shell/bottom-nav";
import { CalendarDays, ClipboardCheck, Gauge, LogIn, NotebookPen, UserRound } from "lucide-react";
import { ICONS } from "@/components/ui/state-badge";
import { RECONCILE_WORDS } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useCallback, useEffect, useMemo, useState } from "react";
import { ContrastToggle } from "@/components/shell/contrast-toggle";
import { BrandLink } from "@/components/shell/brand-link";
import { SyncStatus } from "@/components/shell/sync-status";
import { UserMenu } from "@/components/shell/user-menu";
import { SyncProvider, useOfflineIdentity } from "@/lib/sync/client/react";
import { finishPendingSignOut } from "@/lib/sync/client/erase";
import { useOfflineAccess } from "@/lib/sync/client/use-offline-access";
import { PinUnlock, SignInToOpen } from "./device-lock";
import { ProjectPicker } from "@/components/ui/project-picker";
import { FieldContext, useProjects } from "./field-project";

const NAV = [
  { href: "/field/today", label: "Today", icon: CalendarDays },
  { href: "/field/diary", label: "Diary", icon: NotebookPen },
  { href: "/field/visits", label: "Visits", icon: ClipboardCheck },
  { href: "/tools/evaporation", label: "Calculator", icon: Gauge },
  { href: "/field/conflicts", label: RECONCILE_WORDS.label, icon: ICONS[RECONCILE_WORDS.icon] },
];

const PROJECT_KEY = "pw-field-project";

function FieldProjectPicker({ value, onChange }: { value: string | null; onChange: (id: string | null) => void }) {
  const projects = useProjects();
  if (!projects || projects.length === 0) return null;
  return (
    <ProjectPicker look="header" testId="field-project-switcher" projects={projects} value={value ?? ""} onChange={(id) => onChange(id || null)} className="min-w-0 max-w-[8.5rem]" />
  );
}

function NoIdentity() {
  return (
    <div className="mx-auto mt-10 max-w-md card p-5 text-center" data-testid="field-no-identity">
      <LogIn className="mx-auto h-10 w-10 text-ink-600" aria-hidden="true" />
      <p className="mt-3 text-lg font-semibold text-ink-950">Sign in once with a connection to use this device offline.</p>
      <p className="mt-1 text-muted">Your projects and records are then kept on this device.</p>
      <Link href="/signin" className="mt-4 inline-flex min-h-touch items-center justify-center rounded-lg bg-lichen-700 px-5 font-semibold text-white">
        Sign in
      </Link>
    </div>
  );
}

export function FieldShell({ children }: { children: React.ReactNode }) {
  const { identity: person, source, loading, stored } = useOfflineIdentity();
  // Offline, a remembered person's data opens only within the offline window or with their PIN.
  const { access, unlock } = useOfflineAccess(source === "device" ? stored : null);
  const identity = source === "session" || access === "open" ? person : null;
  const locked = source === "device" && access !== "open";
  const pathname = usePathname();
  const [selectedProjectId, setSelected] = useState<string | null>(null);

  useEffect(() => {
    try {
      // Read once after hydration: the static shell cannot know the choice.
      // eslint-disable-next-line react-hooks/set-state-in-effect
      setSelected(localStorage.getItem(PROJECT_KEY) || null);
    } catch {
      /* private mode: no memory of the choice */
    }
  }, []);
  const selectProject = useCallback((id: string | null) => {
    setSelected(id);
    try {
      if (id) localStorage.setItem(PROJECT_KEY, id);
      else localStorage.removeItem(PROJECT_KEY);
    } catch {
      /* ignore */
    }
  }, []);
  useEffect(() => {
    void finishPendingSignOut();
  }, []);
  const context = useMemo(() => ({ selectedProjectId, selectProject }), [selectedProjectId, selectProject]);
  const isActive = (href: string) => pathname === href || pathname.startsWith(`${href}/`) || (href === "/field/today" && pathname === "/field/placement");

  return (
    <SyncProvider identity={identity} source={source === "session" ? "session" : "device"}>
      <FieldContext.Provider value={context}>
        <div className="flex min-h-dvh flex-col">
          <header className="no-print sticky top-0 z-20 border-b border-ink-800 bg-ink-900 text-white">
            <div className="mx-auto flex max-w-5xl items-center gap-2 px-3 py-2">
              <BrandLink href="/field/today" className="shrink-0" />
              {identity ? <FieldProjectPicker value={selectedProjectId} onChange={selectProject} /> : null}
              <div className="ml-auto flex items-center gap-1">
                <SyncStatus />
                <ContrastToggle />
                {identity ? (
                  <UserMenu user={identity} offline={source === "device"} />
                ) : (
                  <span className="inline-flex min-h-11 items-center px-2 text-sm text-ink-200">
                    <UserRound className="h-5 w-5" aria-hidden="true" />
                  </span>
                )}
              </div>
            </div>
            {identity ? (
              <p className="mx-auto max-w-5xl truncate px-3 pb-1 text-xs text-ink-200" data-testid="field-user-name">
                {identity.name}
                {source === "device" ? " · from this device" : ""}
              </p>
            ) : null}
          </header>

          <main className="mx-auto w-full max-w-5xl flex-1 px-3 pb-28 pt-4">
            {identity ? (
              children
            ) : loading || (locked && access === null) ? (
              <p className="text-muted">Opening…</p>
            ) : locked && access === "pin" && person ? (
              <PinUnlock name={person.name} unlock={unlock} />
            ) : locked ? (
              <SignInToOpen />
            ) : (
              <NoIdentity />
            )}
          </main>

          <BottomNav label="Field" items={NAV} isActive={isActive} testIdPrefix="field-nav-" />
        </div>
      </FieldContext.Provider>
    </SyncProvider>
  );
}
