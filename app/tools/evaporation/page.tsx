import { ArrowLeft, Scale, WifiOff } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";
import { LogoMark } from "@/components/brand/logo-mark";
import { EvaporationCalculator } from "@/components/calculator/evaporation-calculator";

export const metadata: Metadata = {
  title: "Evaporation calculator",
  description: "Evaporation rate of bleed water and plastic shrinkage cracking risk, worked out on the device.",
};

// Outside app/(app): that layout needs a signed-in session, which an offline phone cannot ask for.
// Nothing here reads the request, so the page is prerendered and the service worker precaches it.
export default function EvaporationPage() {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="no-print border-b border-ink-800 bg-ink-900 text-white">
        <div className="mx-auto flex max-w-6xl items-center gap-3 px-3 py-2 lg:px-6">
          <Link href="/today" prefetch={false} className="flex min-h-11 items-center gap-2" aria-label="Placewright, today">
            <LogoMark className="h-9 w-9" />
            <span className="text-lg font-bold tracking-tight">Placewright</span>
          </Link>
          <Link
            href="/today"
            prefetch={false}
            className="ml-auto inline-flex min-h-11 items-center gap-1.5 rounded-md px-2 text-sm font-semibold text-ink-100 hover:bg-white/10"
          >
            <ArrowLeft className="h-4 w-4" aria-hidden="true" />
            Back to Today
          </Link>
        </div>
      </header>

      <main className="mx-auto w-full max-w-6xl flex-1 px-3 pb-10 pt-4 lg:px-6 lg:pt-6">
        <div className="mb-4">
          <div className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2">
            <h1 className="text-2xl font-bold tracking-tight text-ink-950 sm:text-3xl">Evaporation rate</h1>
            <a
              href="#offline"
              className="inline-flex min-h-10 items-center gap-1.5 rounded-full border-2 border-lichen-600 bg-lichen-50 px-3 text-sm font-semibold text-lichen-800 hover:bg-lichen-100"
            >
              <WifiOff className="h-4 w-4" aria-hidden="true" />
              Works offline
            </a>
          </div>
          <p className="mt-1 max-w-3xl text-muted">
            How fast bleed water leaves a fresh slab, and whether plastic shrinkage cracks are likely. Enter the
            conditions at the pour.
          </p>
        </div>

        <EvaporationCalculator />

        <p className="mt-6 flex gap-2 rounded-lg border-2 border-ink-300 bg-white p-3 text-sm font-semibold text-ink-900">
          <Scale className="mt-0.5 h-4 w-4 shrink-0 text-ink-700" aria-hidden="true" />
          The project specifications, local codes and the engineer of record govern. This calculator is a field aid
          for planning precautions, not an approval.
        </p>

        <section id="offline" aria-labelledby="offline-title" className="mt-4 scroll-mt-4 text-sm text-ink-800">
          <h2 id="offline-title" className="flex items-center gap-2 text-base font-bold text-ink-950">
            <WifiOff className="h-4 w-4" aria-hidden="true" />
            Works offline
          </h2>
          <p className="mt-1 max-w-3xl">
            Once this page has been opened on a device, it is kept there and calculates without a connection: nothing
            you enter leaves the phone. Your choice of units is remembered on this device.
          </p>
        </section>
      </main>
    </div>
  );
}
