"use client";

// zod/v4/core holds the one global config that zod's full API reads too; importing `z` here would
// ship all of zod on every page, including those that validate nothing.
import { config as zodConfig } from "zod/v4/core";
import { ServiceWorkerRegistration } from "./service-worker";

// zod's fast path probes `new Function`, which the Content-Security-Policy forbids (no eval):
// validate without it on the device.
zodConfig({ jitless: true });

/** What every page needs; the session and query cache are in signed-in-providers.tsx. */
export function Providers({ children }: { children: React.ReactNode }) {
  return (
    <>
      <ServiceWorkerRegistration />
      {children}
    </>
  );
}
