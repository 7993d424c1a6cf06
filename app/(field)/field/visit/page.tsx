import type { Metadata } from "next";
import { Suspense } from "react";
import { VisitScreen } from "@/components/site-visits/visit-screen";

export const metadata: Metadata = { title: "Site visit" };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <VisitScreen />
    </Suspense>
  );
}
