import { FieldShell } from "@/components/field/field-shell";
import { SignedInProviders } from "@/components/providers/signed-in-providers";

// Static on purpose (no session, cookies or headers): the service worker precaches these shells and
// the screens read everything from the device database (STACK.md "Offline screens in the App Router").
export default function FieldLayout({ children }: { children: React.ReactNode }) {
  return (
    <SignedInProviders>
      <FieldShell>{children}</FieldShell>
    </SignedInProviders>
  );
}
