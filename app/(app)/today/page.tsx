import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { requireUser } from "@/lib/auth/session";
import { listUserProjects } from "@/lib/users/queries";

export const metadata: Metadata = { title: "Today" };

export default async function TodayPage() {
  const user = await requireUser();
  const projects = await listUserProjects(user.id);
  const today = new Intl.DateTimeFormat("en-US", { weekday: "long", month: "long", day: "numeric" }).format(new Date());

  return (
    <>
      <PageHeader
        title="Today"
        subtitle={today}
        actions={
          <Link
            href="/field/today"
            data-testid="open-field"
            className="inline-flex min-h-touch items-center rounded-lg bg-lichen-700 px-4 font-semibold text-white hover:bg-lichen-800"
          >
            Field view (works offline)
          </Link>
        }
      />
      {projects.length === 0 ? (
        <div className="card p-5" data-testid="no-projects">
          <p className="text-lg font-semibold">You are not on any project yet.</p>
          <p className="mt-1 text-muted">
            {user.isAdmin
              ? "Create a project or add yourself to one under Admin."
              : "Ask your administrator to add you to a project."}
          </p>
        </div>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2" data-testid="today-projects">
          {projects.map((p) => (
            <li key={p.id} className="card p-4">
              <div className="flex items-start justify-between gap-2">
                <Link href={`/projects/${p.id}`} className="text-lg font-bold text-ink-950 underline-offset-4 hover:underline">
                  {p.name}
                </Link>
                <span className="rounded-full bg-ink-100 px-2.5 py-1 text-xs font-semibold text-ink-800">{ROLE_LABELS[p.role]}</span>
              </div>
              <p className="mt-3 text-muted">No placements planned for today or tomorrow.</p>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
