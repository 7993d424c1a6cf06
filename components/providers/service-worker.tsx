"use client";

import { RefreshCw } from "lucide-react";
import { useEffect, useState } from "react";
import type { Workbox } from "workbox-window";
import { useAnyFormDirty } from "@/lib/ui/dirty-forms";

/**
 * Registers public/sw.js (production builds only; `next dev` serves no service worker) and, when a
 * new version is waiting, offers a reload — only while no form on the page holds unsaved input.
 */
export function ServiceWorkerRegistration() {
  const [wb, setWb] = useState<Workbox | null>(null);
  const [waiting, setWaiting] = useState(false);
  const formDirty = useAnyFormDirty();

  useEffect(() => {
    if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
    let cancelled = false;
    import("workbox-window").then(({ Workbox }) => {
      if (cancelled) return;
      const instance = new Workbox("/sw.js", { scope: "/" });
      instance.addEventListener("waiting", () => setWaiting(true));
      instance.register().catch((error) => console.warn("Service worker registration failed", error));
      setWb(instance);
    });
    return () => {
      cancelled = true;
    };
  }, []);

  if (!waiting || formDirty || !wb) return null;
  const reload = () => {
    wb.addEventListener("controlling", () => window.location.reload());
    wb.messageSkipWaiting();
  };
  return (
    <div role="status" data-testid="update-ready" className="no-print fixed inset-x-3 bottom-20 z-40 mx-auto flex max-w-md items-center gap-3 rounded-lg bg-ink-900 p-3 text-white shadow-lg md:bottom-4">
      <RefreshCw className="h-5 w-5 shrink-0" aria-hidden="true" />
      <p className="flex-1 text-sm">A new version of Placewright is ready. Your saved work is kept.</p>
      <button type="button" onClick={reload} className="min-h-11 rounded-md bg-lichen-600 px-3 font-semibold">
        Reload
      </button>
    </div>
  );
}
