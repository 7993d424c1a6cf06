import type { Metadata } from "next";
import { Suspense } from "react";
import { DiaryScreen } from "@/components/field/diary-screen";

export const metadata: Metadata = { title: "Daily diary" };

export default function Page() {
  return (
    <Suspense fallback={<p className="text-muted">Opening…</p>}>
      <DiaryScreen />
    </Suspense>
  );
}
