import type { Metadata } from "next";
import { AccountSettingsForm } from "@/components/admin/account-settings-form";
import { InviteForm } from "@/components/admin/invite-form";
import { PersonStatus } from "@/components/admin/person-status";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { listProjectsWithCounts, listUsers } from "@/lib/projects/admin";
import { readAccountSettings } from "@/lib/users/admin-accounts";
import { listPendingInvitations } from "@/lib/users/invitations";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { Table } from "@/components/ui/table";

export const metadata: Metadata = { title: "People" };

export default async function AdminPeoplePage() {
  const user = await requireUser();
  const [people, projects, settings, pending] = await Promise.all([listUsers(user), listProjectsWithCounts(user), readAccountSettings(), listPendingInvitations(user)]);
  return (
    <>
      <PageHeader title="People" subtitle="Everyone with an account, and invitations to new people." />
      <div className="grid gap-4 lg:grid-cols-[1fr_24rem]">
        <section className="card overflow-x-auto">
          <Table columns={["Name", "E-mail", "Status", { label: "Actions", hidden: true }]} testId="people-table">
              {people.map((p) => (
                <tr key={p.id}>
                  <td className="px-3 py-2 font-semibold">{p.name}{p.isAdmin ? <span className="ml-2 rounded bg-ink-100 px-1.5 py-0.5 text-xs">admin</span> : null}</td>
                  <td className="px-3 py-2">{p.email}</td>
                  <td className="px-3 py-2">{p.disabled ? "Disabled" : p.hasPassword ? "Active" : "Invited"}</td>
                  <td className="px-3 py-2"><PersonStatus id={p.id} name={p.name} disabled={p.disabled} self={p.id === user.id} /></td>
                </tr>
              ))}
              {/* Invited people have no account until they accept; the invitation shows at once (the form refreshes this page). */}
              {pending.map((i) => (
                <tr key={i.id} data-testid="pending-invitation">
                  <td className="px-3 py-2 font-semibold">{i.name}</td>
                  <td className="break-all px-3 py-2">{i.email}</td>
                  <td className="px-3 py-2">
                    Invited, not yet accepted
                    {i.projectName ? <span className="block text-muted">{i.projectName}{i.role ? `, ${ROLE_LABELS[i.role]}` : ""}</span> : null}
                  </td>
                  <td className="px-3 py-2" />
                </tr>
              ))}
            </Table>
        </section>
        <div className="flex flex-col gap-4">
          <InviteForm projects={projects.map((p) => ({ id: p.id, name: p.name }))} />
          <AccountSettingsForm initial={settings} />
        </div>
      </div>
    </>
  );
}
