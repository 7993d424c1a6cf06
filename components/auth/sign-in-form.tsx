"use client";

import { useRouter, useSearchParams } from "next/navigation";
import { Suspense, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { lazyResolver } from "@/lib/ui/lazy-resolver";
import type { LinkValues, PasswordValues } from "./sign-in-schemas";

const passwordResolver = lazyResolver<PasswordValues>(() => import("./sign-in-schemas").then((m) => m.passwordResolver));
const linkResolver = lazyResolver<LinkValues>(() => import("./sign-in-schemas").then((m) => m.linkResolver));

/** The notice for `?error=` (a failed sign-in link). It alone reads the query, in its own Suspense
 * boundary, so the prerendered page carries the form itself (the largest paint) without waiting for scripts. */
function ErrorFromLink() {
  const params = useSearchParams();
  return params.get("error") ? <Notice tone="danger" title="Sign-in failed. Try again." testId="signin-error" /> : null;
}

/** Where to go after signing in; read when the form is sent, so the page needs no query to render. */
function callbackPath(): string {
  return safeCallbackPath(new URLSearchParams(window.location.search).get("callbackUrl"));
}

export function SignInForm() {
  const router = useRouter();
  const [mode, setMode] = useState<"password" | "link">("password");
  const [error, setError] = useState<string | null>(null);
  const [tried, setTried] = useState(false);
  const [linkSent, setLinkSent] = useState<string | null>(null);

  const pw = useForm<PasswordValues>({ resolver: passwordResolver });
  const link = useForm<LinkValues>({ resolver: linkResolver });

  const onPassword = pw.handleSubmit(async (values) => {
    setError(null);
    setTried(true);
    const callbackUrl = callbackPath();
    // next-auth's client (about 14 KB) loads on submit: the page itself needs none of it.
    const { signIn } = await import("next-auth/react");
    const result = await signIn("password", { ...values, redirect: false });
    if (!result || result.error) {
      setError(result?.error && result.error !== "CredentialsSignin" ? result.error : "Sign-in failed. Try again.");
      return;
    }
    router.replace(callbackUrl);
    router.refresh();
  });

  const onLink = link.handleSubmit(async (values) => {
    setError(null);
    setTried(true);
    const callbackUrl = callbackPath();
    const res = await fetch("/api/sign-in-link", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ ...values, callbackUrl }),
    }).catch(() => null);
    if (!res) return setError("No connection. Sign-in links need a network; try again when you have signal.");
    if (!res.ok) {
      const body = await res.json().catch(() => null);
      return setError(body?.error?.message ?? "The link could not be sent. Try again.");
    }
    setLinkSent(values.email);
  });

  return (
    <section className="card flex flex-col gap-5 p-5" aria-labelledby="signin-title">
      <h1 id="signin-title" className="text-xl font-bold">
        Sign in
      </h1>
      <div className="grid grid-cols-2 gap-1 rounded-lg bg-ink-100 p-1" role="tablist" aria-label="How to sign in">
        {(["password", "link"] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="tab"
            aria-selected={mode === m}
            onClick={() => {
              setMode(m);
              setError(null);
              setTried(true);
            }}
            className={`min-h-touch rounded-md text-sm font-semibold ${mode === m ? "bg-white text-ink-950 shadow" : "text-ink-700"}`}
          >
            {m === "password" ? "Password" : "E-mail me a link"}
          </button>
        ))}
      </div>

      {error ? (
        <Notice tone="danger" title={error} testId="signin-error" />
      ) : tried ? null : (
        <Suspense>
          <ErrorFromLink />
        </Suspense>
      )}

      {mode === "password" ? (
        <form onSubmit={onPassword} className="flex flex-col gap-4" noValidate>
          <Field label="E-mail" type="email" autoComplete="username" inputMode="email" error={pw.formState.errors.email?.message} {...pw.register("email")} />
          <Field label="Password" type="password" autoComplete="current-password" error={pw.formState.errors.password?.message} {...pw.register("password")} />
          <Button type="submit" block disabled={pw.formState.isSubmitting}>
            {pw.formState.isSubmitting ? "Signing in…" : "Sign in"}
          </Button>
        </form>
      ) : linkSent ? (
        <Notice tone="success" title="Check your e-mail" testId="link-sent">
          If {linkSent} has an account, a sign-in link is on its way. It works once and expires in 15 minutes.
        </Notice>
      ) : (
        <form onSubmit={onLink} className="flex flex-col gap-4" noValidate>
          <Field label="E-mail" type="email" autoComplete="username" inputMode="email" error={link.formState.errors.email?.message} {...link.register("email")} />
          <Button type="submit" block disabled={link.formState.isSubmitting}>
            {link.formState.isSubmitting ? "Sending…" : "Send me a sign-in link"}
          </Button>
        </form>
      )}
      <p className="text-sm text-muted">
        No account? Ask your company&apos;s Placewright administrator for an invitation.
      </p>
    </section>
  );
}
