import type { Metadata } from "next";
import { Suspense } from "react";
import { LinkSignIn } from "@/components/auth/link-sign-in";

export const metadata: Metadata = { title: "Signing in" };

export default function LinkPage() {
  return (
    <Suspense>
      <LinkSignIn />
    </Suspense>
  );
}
