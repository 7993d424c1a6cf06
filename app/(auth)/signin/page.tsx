import type { Metadata } from "next";
import { SignInForm } from "@/components/auth/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  // The form reads the query only inside its own Suspense boundaries, so it is prerendered.
  return <SignInForm />;
}
