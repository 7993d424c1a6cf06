import type { Metadata } from "next";
import { Suspense } from "react";
import { PlacementScreen } from "@/components/field/placement-screen";

export const metadata: Metadata = { title: "Placement" };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <PlacementScreen />
    </Suspense>
  );
}
