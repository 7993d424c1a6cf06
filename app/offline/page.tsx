import type { Metadata } from "next";
import Link from "next/link";
import { LogoMark } from "@/components/brand/logo-mark";

export const metadata: Metadata = { title: "Offline" };

/** Served by the service worker when a page that needs the network is opened offline. */
export default function OfflinePage() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-4 px-4">
      <LogoMark className="h-12 w-12" />
      <h1 className="text-2xl font-bold">You are offline</h1>
      <p className="text-muted">
        This page needs a connection. Screens you use in the field keep working offline, and everything you
        save waits on this device until the network returns.
      </p>
      <Link href="/tools/evaporation" className="font-semibold text-lichen-700 underline">
        Open the evaporation calculator
      </Link>
    </main>
  );
}
