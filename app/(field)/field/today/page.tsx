import type { Metadata } from "next";
import { Suspense } from "react";
import { TodayScreen } from "@/components/field/today-screen";

export const metadata: Metadata = { title: "Today" };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <TodayScreen />
    </Suspense>
  );
}
