import type { Metadata } from "next";
import { Suspense } from "react";
import { ConflictsScreen } from "@/components/field/conflicts-screen";
import { RECONCILE_WORDS } from "@/lib/ui/vocabulary";

export const metadata: Metadata = { title: RECONCILE_WORDS.label };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <ConflictsScreen />
    </Suspense>
  );
}
