import type { Metadata } from "next";
import Link from "next/link";
import { ProjectForm } from "@/components/admin/project-form";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { listProjectsWithCounts } from "@/lib/projects/admin";
import { Table } from "@/components/ui/table";

export const metadata: Metadata = { title: "Projects (admin)" };

export default async function AdminProjectsPage() {
  const user = await requireUser();
  const projects = await listProjectsWithCounts(user);
  return (
    <>
      <PageHeader title="Projects" subtitle="Create projects and manage who works on them." />
      <div className="grid gap-4 lg:grid-cols-[1fr_24rem]">
        <section className="card overflow-x-auto">
          {projects.length === 0 ? (
            <p className="p-4 text-muted">No projects yet.</p>
          ) : (
            <Table columns={["Project", "Code", "Units", { label: "Members", align: "right" }]} testId="admin-projects">
                {projects.map((p) => (
                  <tr key={p.id}>
                    <td className="px-3 py-2 font-semibold">
                      <Link href={`/admin/projects/${p.id}`} className="text-lichen-700 underline-offset-4 hover:underline">{p.name}</Link>
                    </td>
                    <td className="px-3 py-2 font-mono">{p.code}</td>
                    <td className="px-3 py-2">{p.unitSystem === "IP" ? "Inch-pound" : "SI"}</td>
                    <td className="px-3 py-2 text-right font-mono">{p.members}</td>
                  </tr>
                ))}
              </Table>
          )}
        </section>
        <ProjectForm />
      </div>
    </>
  );
}
