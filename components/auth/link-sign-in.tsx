"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { safeCallbackPath } from "@/lib/auth/callback-url";

/** Exchanges the one-time token from the e-mail for a session, once. */
export function LinkSignIn() {
  const params = useSearchParams();
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const started = useRef(false);

  useEffect(() => {
    if (started.current) return;
    started.current = true;
    const token = params.get("token") ?? "";
    const callbackUrl = safeCallbackPath(params.get("callbackUrl"));
    signIn("link", { token, redirect: false }).then((result) => {
      if (!result || result.error) {
        setError(result?.error ?? "This sign-in link did not work. Ask for a new one.");
      } else {
        router.replace(callbackUrl);
        router.refresh();
      }
    });
  }, [params, router]);

  return (
    <section className="card flex flex-col gap-4 p-5">
      {error ? (
        <>
          <Notice tone="danger" title={error} testId="link-error" />
          <Link href="/signin" className="font-semibold text-lichen-700 underline">
            Back to sign-in
          </Link>
        </>
      ) : (
        <p className="text-lg font-semibold">Signing you in…</p>
      )}
    </section>
  );
}
