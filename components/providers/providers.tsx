"use client";

import { ServiceWorkerRegistration } from "./service-worker";

// zod's fast path probes `new Function`, which the Content-Security-Policy forbids (no eval):
// validate without it on the device. zod keeps its one global config on globalThis (so that every
// copy of zod shares it; zod/v4/core/core.js): seeding it here costs nothing, where importing zod's
// config() would ship about 5 KB of zod to every page, and all of zod with `z`.
// tests/unit/zod-jitless.test.ts fails if a zod upgrade moves it.
const zodGlobal = globalThis as { __zod_globalConfig?: { jitless?: boolean } };
Object.assign((zodGlobal.__zod_globalConfig ??= {}), { jitless: true });

/** What every page needs; the session and query cache are in signed-in-providers.tsx. */
export function Providers({ children }: { children: React.ReactNode }) {
  return (
    <>
      <ServiceWorkerRegistration />
      {children}
    </>
  );
}
