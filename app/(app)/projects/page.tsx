import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { requireUser } from "@/lib/auth/session";
import { readableProjects } from "@/lib/projects/readable";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const user = await requireUser();
  const projects = await readableProjects(user);
  return (
    <>
      <PageHeader title="My projects" subtitle="The projects you belong to and your role on each." />
      {projects.length === 0 ? (
        <p className="card p-5 text-lg" data-testid="no-projects">You are not on any project yet.</p>
      ) : (
        <ul className="card divide-y divide-ink-100" data-testid="project-list">
          {projects.map((p) => (
            <li key={p.id}>
              <Link href={`/projects/${p.id}`} className="flex min-h-touch items-center justify-between gap-3 px-4 py-3 hover:bg-ink-50">
                <span>
                  <span className="block font-semibold text-ink-950" data-testid="project-name">{p.name}</span>
                  <span className="text-sm text-muted">
                    {p.code} · {p.unitSystem === "IP" ? "inch-pound units" : "SI units"} · {p.timeZone}
                  </span>
                </span>
                <span className="rounded-full bg-ink-100 px-2.5 py-1 text-xs font-semibold text-ink-800">{ROLE_LABELS[p.role]}</span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
