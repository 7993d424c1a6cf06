"use client";

import { useEffect } from "react";

/** Registers public/sw.js (production builds only; `next dev` serves no service worker). */
export function ServiceWorkerRegistration() {
  useEffect(() => {
    if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
    let cancelled = false;
    import("workbox-window").then(({ Workbox }) => {
      if (cancelled) return;
      const wb = new Workbox("/sw.js", { scope: "/" });
      wb.register().catch((error) => console.warn("Service worker registration failed", error));
    });
    return () => {
      cancelled = true;
    };
  }, []);
  return null;
}
