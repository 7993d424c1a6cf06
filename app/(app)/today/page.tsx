import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { requireUser } from "@/lib/auth/session";
import { readableProjects } from "@/lib/projects/readable";
import type { SessionUser } from "@/lib/auth/options";
import { StateBadge } from "@/components/ui/state-badge";
import type { PlacementState } from "@/lib/records/enums";
import { listRecords } from "@/lib/records/read";
import { formatInstant, instantFormatter, localDate } from "@/lib/time/zone";

export const metadata: Metadata = { title: "Today" };

/** Placements planned for today and tomorrow in the project's own time zone. */
async function todayAndTomorrow(user: SessionUser, projectId: string, timeZone: string) {
  const day = (d: Date) => localDate(d, timeZone);
  const now = new Date();
  const { items } = await listRecords({ user }, "placements", projectId, { from: day(now), to: day(new Date(now.getTime() + 86_400_000)), limit: "50" });
  const time = instantFormatter(timeZone, "weekdayTime");
  return items.map((row) => ({
    id: row.id,
    element: String(row.element),
    state: row.state as PlacementState,
    start: row.plannedStart ? time.format(new Date(row.plannedStart as string)) : "No start time",
  }));
}

export default async function TodayPage() {
  const user = await requireUser();
  const projects = await Promise.all(
    (await readableProjects(user)).map(async (p) => ({ ...p, placements: await todayAndTomorrow(user, p.id, p.timeZone) })),
  );
  const today = formatInstant(new Date(), undefined, "longDay");

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
              {p.placements.length === 0 ? (
                <p className="mt-3 text-muted">No placements planned for today or tomorrow.</p>
              ) : (
                <ul className="mt-3 divide-y divide-ink-100" data-testid="today-placements">
                  {p.placements.map((pl) => (
                    <li key={pl.id}>
                      <Link href={`/field/placement?id=${pl.id}`} className="flex min-h-touch items-center justify-between gap-2 py-2 hover:bg-ink-50">
                        <span>
                          <span className="block font-semibold">{pl.element}</span>
                          <span className="text-sm text-muted">{pl.start}</span>
                        </span>
                        <StateBadge kind="placement" code={pl.state} size="sm" testId="placement-state" />
                      </Link>
                    </li>
                  ))}
                </ul>
              )}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
