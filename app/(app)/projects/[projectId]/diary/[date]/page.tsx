import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StoredPhotos } from "@/components/photos/stored-photos";
import { AuditTrail } from "@/components/audit/audit-trail";
import { Empty, Facts, MiniTable, Section } from "@/components/review/detail-parts";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { formatVolume } from "@/lib/concrete/units";
import { AppError } from "@/lib/errors";
import { StateBadge } from "@/components/ui/state-badge";
import { loadDiaryReview, type DiaryReview } from "@/lib/review/diary-detail";
import { calendarDateText, instantFormatter } from "@/lib/time/zone";

export const metadata: Metadata = { title: "Daily diary" };

export default async function DiaryReviewPage({ params }: { params: Promise<{ projectId: string; date: string }> }) {
  const { projectId, date } = await params;
  const user = await requireUser();
  let data: DiaryReview;
  try {
    data = await loadDiaryReview(await accessTo(user, projectId), date);
  } catch (error) {
    if (error instanceof AppError && error.code === "forbidden") return <Notice tone="danger" title="This diary is not available to you.">{error.message}</Notice>;
    if (error instanceof AppError && (error.code === "not_found" || error.code === "invalid_input")) notFound();
    throw error;
  }
  const { project, diary } = data;
  const units = project.unitSystem;
  const dayTime = instantFormatter(project.timeZone, "dayTime");
  const longDate = calendarDateText(date, "longDate");
  return (
    <div className="space-y-3" data-testid="diary-review">
      <PageHeader
        title={`Daily diary · ${longDate}`}
        subtitle={<Link href={`/projects/${projectId}`} className="underline-offset-4 hover:underline">{project.name}</Link>}
        actions={
          <>
            <Link href="/review" className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50">Back to review</Link>
            <a href={`/api/projects/${projectId}/reports/daily?date=${date}`} className="rounded-md border border-ink-300 bg-white px-3 py-1.5 text-sm font-semibold hover:bg-ink-50" data-testid="daily-pdf">Daily report (PDF)</a>
          </>
        }
      />
      {!diary ? (
        <Notice tone="danger" title="No diary for this day" testId="diary-missing">
          The superintendent has not written a diary for {longDate}. It is written in the field diary screen.
        </Notice>
      ) : (
        <Section title="Diary" testId="section-diary">
          <Facts
            items={[
              ["Status", diary.submittedAt ? "Submitted" : "Draft, not submitted"],
              ["Submitted", diary.submittedAt ? `${dayTime.format(diary.submittedAt)}${diary.submittedByName ? ` by ${diary.submittedByName}` : ""}` : "—"],
              ["Crew on site", data.crew.reduce((s, c) => s + c.count, 0)],
              ["Delays", `${data.delays.reduce((s, d) => s + d.minutes, 0)} min`],
            ]}
          />
          <div className="mt-3 grid gap-3 text-sm lg:grid-cols-3">
            <div><h3 className="text-xs font-semibold uppercase text-ink-600">Weather</h3><p className="whitespace-pre-wrap">{diary.weatherSummary || "—"}</p></div>
            <div><h3 className="text-xs font-semibold uppercase text-ink-600">Work done</h3><p className="whitespace-pre-wrap">{diary.workDone || "—"}</p></div>
            <div><h3 className="text-xs font-semibold uppercase text-ink-600">Safety</h3><p className="whitespace-pre-wrap">{diary.safetyNotes || "—"}</p></div>
          </div>
          <div className="mt-2"><AuditTrail look="inline" projectId={projectId} recordId={diary.id} timeZone={project.timeZone} label="Audit trail" /></div>
        </Section>
      )}
      {diary ? (
        <div className="grid gap-3 lg:grid-cols-2">
          <Section title="Crew" count={data.crew.length}>
            {data.crew.length ? <MiniTable head={["Trade", "Count"]} rows={data.crew.map((c) => ({ key: c.id, cells: [c.trade, c.count] }))} /> : <Empty>None recorded.</Empty>}
          </Section>
          <Section title="Equipment" count={data.equipment.length}>
            {data.equipment.length ? <MiniTable head={["Equipment", "Count", "Hours"]} rows={data.equipment.map((e) => ({ key: e.id, cells: [e.name, e.count ?? "—", e.hours ?? "—"] }))} /> : <Empty>None recorded.</Empty>}
          </Section>
          <Section title="Delays" count={data.delays.length}>
            {data.delays.length ? <MiniTable head={["Cause", "Minutes", "What happened"]} rows={data.delays.map((d) => ({ key: d.id, cells: [d.cause, d.minutes, d.description] }))} /> : <Empty>None recorded.</Empty>}
          </Section>
          <Section title="Visitors" count={data.visitors.length}>
            {data.visitors.length ? <MiniTable head={["Name", "Company", "Purpose"]} rows={data.visitors.map((v) => ({ key: v.id, cells: [v.name, v.company, v.purpose] }))} /> : <Empty>None recorded.</Empty>}
          </Section>
        </div>
      ) : null}
      <Section title="Placements of the day" count={data.placements.length} testId="section-day-placements">
        {data.placements.length === 0 ? (
          <Empty>No placements planned for this day.</Empty>
        ) : (
          <MiniTable
            head={["Element", "Mix", "Placed", "Trucks", "Late", "Out-of-tolerance tests", "State"]}
            rows={data.placements.map((p) => ({
              key: p.id,
              tone: p.hasWarnings ? "danger" : undefined,
              cells: [
                <Link key="e" href={`/projects/${projectId}/placements/${p.id}/review`} className="font-semibold text-lichen-800 hover:underline">{p.element}</Link>,
                p.mixCode ?? "—",
                formatVolume(p.placedM3, units, 1),
                p.trucks,
                p.lateTrucks,
                p.testsOut,
                <StateBadge key="s" kind="placement" code={p.state} size="sm" testId="placement-state" />,
              ],
            }))}
          />
        )}
      </Section>
      {diary ? (
        <Section title="Photos">
          {data.photos.length ? <StoredPhotos projectId={projectId} photos={data.photos} /> : <Empty>No photos.</Empty>}
        </Section>
      ) : null}
    </div>
  );
}
