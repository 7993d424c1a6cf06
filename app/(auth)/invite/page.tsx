import type { Metadata } from "next";
import Link from "next/link";
import { AcceptInvitationForm } from "@/components/auth/accept-invitation-form";
import { Notice } from "@/components/ui/notice";
import { findOpenInvitation } from "@/lib/users/invitations";

export const metadata: Metadata = { title: "Accept invitation" };
export const dynamic = "force-dynamic";

export default async function InvitePage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token = "" } = await searchParams;
  const invitation = token ? await findOpenInvitation(token) : undefined;
  if (!invitation) {
    return (
      <section className="card flex flex-col gap-4 p-5">
        <Notice tone="danger" title="This invitation has expired or was already used.">
          Ask your administrator to send a new one.
        </Notice>
        <Link href="/signin" className="font-semibold text-lichen-700 underline">
          Go to sign-in
        </Link>
      </section>
    );
  }
  return <AcceptInvitationForm token={token} email={invitation.email} name={invitation.name} />;
}
