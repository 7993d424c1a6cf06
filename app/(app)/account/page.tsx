import type { Metadata } from "next";
import { DevicePinForm } from "@/components/account/device-pin-form";
import { PasswordForm } from "@/components/account/password-form";
import { SignOutEverywhere } from "@/components/account/sign-out-everywhere";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { accountSummary } from "@/lib/users/account";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await requireUser();
  const { hasPassword } = await accountSummary(user);
  return (
    <>
      <PageHeader title="Your account" subtitle={`${user.name} · ${user.email}`} />
      <div className="grid gap-4 lg:grid-cols-2">
        <PasswordForm hasPassword={hasPassword} />
        <div className="flex flex-col gap-4">
          <DevicePinForm user={{ id: user.id, name: user.name, email: user.email, isAdmin: user.isAdmin }} />
          <SignOutEverywhere />
        </div>
      </div>
    </>
  );
}
