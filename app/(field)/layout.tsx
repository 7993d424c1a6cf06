import { FieldShell } from "@/components/field/field-shell";

// Static on purpose (no session, cookies or headers): the service worker precaches these shells and
// the screens read everything from the device database (STACK.md "Offline screens in the App Router").
export default function FieldLayout({ children }: { children: React.ReactNode }) {
  return <FieldShell>{children}</FieldShell>;
}
