"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { SessionProvider } from "next-auth/react";
import { useState } from "react";
import { z } from "zod";
import { ServiceWorkerRegistration } from "./service-worker";

// zod's fast path probes `new Function`, which the Content-Security-Policy forbids (no eval):
// validate without it on the device.
z.config({ jitless: true });

export function Providers({ children }: { children: React.ReactNode }) {
  const [queryClient] = useState(
    () => new QueryClient({ defaultOptions: { queries: { staleTime: 30_000, retry: 1 } } }),
  );
  return (
    <SessionProvider refetchOnWindowFocus={false}>
      <QueryClientProvider client={queryClient}>
        <ServiceWorkerRegistration />
        {children}
      </QueryClientProvider>
    </SessionProvider>
  );
}
