import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PlacementList } from "@/components/placements/placement-list";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { accessTo, type ProjectAccess } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { listPlacementsForScreen } from "@/lib/placements/queries";
import { getProjectForMember } from "@/lib/projects/queries";
import { localDate } from "@/lib/time/zone";

export const metadata: Metadata = { title: "Project" };


export default async function ProjectPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string }>;
  searchParams: Promise<{ date?: string }>;
}) {
  const { projectId } = await params;
  // `?date=YYYY-MM-DD` (the daily digest links here) narrows the list to that day on site.
  const { date: rawDate } = await searchParams;
  const date = rawDate && /^\d{4}-\d{2}-\d{2}$/.test(rawDate) ? rawDate : null;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  let access: ProjectAccess;
  let data;
  try {
    access = await accessTo(user, projectId);
    data = await getProjectForMember(access);
  } catch (error) {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "forbidden")) {
      return <Notice tone="danger" title="This project is not available to you." testId="project-forbidden">You are not a member of it. Ask your administrator if you should be.</Notice>;
    }
    throw error;
  }
  const { project, role, members } = data;
  const all = await listPlacementsForScreen(access);
  const placements = date ? all.filter((p) => p.plannedStart && localDate(new Date(p.plannedStart), project.timeZone) === date) : all;
  return (
    <>
      <PageHeader
        title={project.name}
        subtitle={`${project.code} · your role: ${role ? ROLE_LABELS[role] : "none"}`}
        actions={
          <>
            <Link href={`/projects/${projectId}/mixes`} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold text-ink-900 hover:bg-ink-50" data-testid="mixes-link">Mix designs</Link>
            <Link href={`/projects/${projectId}/lab`} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold text-ink-900 hover:bg-ink-50" data-testid="lab-link">Lab results</Link>
            <Link href={`/projects/${projectId}/digest`} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold text-ink-900 hover:bg-ink-50" data-testid="digest-link">Daily digest</Link>
          </>
        }
      />
      <div className="grid gap-4 lg:grid-cols-3">
        <section className="card p-4 lg:col-span-2" aria-labelledby="placements-title">
          <h2 id="placements-title" className="text-lg font-bold">{date ? `Placements on ${date}` : "Placements"}</h2>
          {date ? (
            <p className="mt-1 text-sm" data-testid="day-filter">
              Showing one day.{" "}
              <Link href={`/projects/${projectId}`} className="font-semibold text-lichen-700 underline">
                Show every placement
              </Link>
            </p>
          ) : null}
          {date && placements.length === 0 ? (
            <p className="mt-2 text-muted" data-testid="no-placements">No placements on this day.</p>
          ) : (
            <PlacementList placements={placements} unitSystem={project.unitSystem} timeZone={project.timeZone} />
          )}
        </section>
        <section className="card p-4" aria-labelledby="project-facts">
          <h2 id="project-facts" className="text-lg font-bold">Project</h2>
          <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
            <dt className="text-muted">Site</dt>
            <dd>{project.siteAddress || "Not set"}</dd>
            <dt className="text-muted">Time zone</dt>
            <dd>{project.timeZone}</dd>
            <dt className="text-muted">Units</dt>
            <dd>{project.unitSystem === "IP" ? "Inch-pound" : "SI (metric)"}</dd>
            <dt className="text-muted">Specification</dt>
            <dd>{project.specEditions || "Not recorded"}</dd>
            <dt className="text-muted">Truck time limit</dt>
            <dd>{project.dischargeLimitMinutes} min from batching</dd>
          </dl>
          <h3 className="mt-4 font-bold">Members</h3>
          <ul className="mt-1 text-sm" data-testid="member-list">
            {members.map((m) => (
              <li key={m.userId} className="flex justify-between gap-2 py-1">
                <span>{m.name}</span>
                <span className="text-muted">{ROLE_LABELS[m.role]}</span>
              </li>
            ))}
          </ul>
        </section>
      </div>
    </>
  );
}
