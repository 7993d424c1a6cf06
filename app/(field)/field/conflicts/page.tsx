import type { Metadata } from "next";
import { Suspense } from "react";
import { ConflictsScreen } from "@/components/field/conflicts-screen";

export const metadata: Metadata = { title: "Conflicts" };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <ConflictsScreen />
    </Suspense>
  );
}
