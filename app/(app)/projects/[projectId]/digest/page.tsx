import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DigestHistory, type HistoryItem } from "@/components/digest/digest-history";
import { DigestPreview } from "@/components/digest/digest-preview";
import { DigestRecipients, type RecipientItem } from "@/components/digest/digest-recipients";
import { OwnerPreferences } from "@/components/digest/owner-preferences";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo, type ProjectAccess } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { getDigestHistory, getDigestView, type DigestView } from "@/lib/digest/access";
import { hourLabel } from "@/lib/digest/hours";
import { AppError } from "@/lib/errors";
import { instantFormatter } from "@/lib/time/zone";

export const metadata: Metadata = { title: "Daily digest" };

export default async function DigestPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  let view: DigestView;
  let access: ProjectAccess;
  try {
    access = await accessTo(user, projectId);
    view = await getDigestView(access);
  } catch (error) {
    if (error instanceof AppError && (error.code === "forbidden" || error.code === "not_found")) {
      return <Notice tone="danger" title="The digest settings are not available to you." testId="digest-forbidden">They are for the project office and the project&apos;s owners.</Notice>;
    }
    throw error;
  }
  const { project } = view;
  const when = instantFormatter(project.timeZone, "dayTime");
  const recipients: RecipientItem[] = view.recipients.map((r) => ({
    id: r.id,
    email: r.email,
    name: r.name,
    source: r.source,
    hourOverride: r.hourOverride,
    sendEmptyDays: r.sendEmptyDays,
    status: r.status,
    own: r.userId === user.id,
  }));
  const showHistory = view.canManage || user.isAdmin;
  const history: HistoryItem[] = showHistory
    ? (await getDigestHistory(access)).map((h) => ({
        key: `${h.date}:${h.recipientEmail}`,
        date: h.date,
        recipientEmail: h.recipientEmail,
        status: h.status,
        sentAt: h.sentAt ? when.format(h.sentAt) : null,
        by: h.sentByName ? `Sent now by ${h.sentByName}` : "Scheduled",
      }))
    : [];
  return (
    <>
      <PageHeader
        title="Daily digest"
        subtitle={
          <>
            <Link href={`/projects/${projectId}`} className="underline-offset-4 hover:underline">{project.name}</Link>
            {` · sent at ${hourLabel(project.digestHour)} ${project.timeZone} unless a recipient chose another hour`}
          </>
        }
      />
      {view.canManage ? (
        <div className="flex flex-col gap-4">
          <DigestRecipients projectId={projectId} digestHour={project.digestHour} timeZone={project.timeZone} recipients={recipients} />
          <DigestPreview projectId={projectId} today={project.today} />
          <DigestHistory history={history} />
        </div>
      ) : view.role === "owner" ? (
        <OwnerPreferences projectId={projectId} projectName={project.name} digestHour={project.digestHour} timeZone={project.timeZone} recipient={recipients.find((r) => r.own) ?? null} />
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-muted">As an administrator you see who receives this project&apos;s digest; the project office manages it.</p>
          <DigestRecipients projectId={projectId} digestHour={project.digestHour} timeZone={project.timeZone} recipients={recipients} readOnly />
          <DigestHistory history={history} />
        </div>
      )}
    </>
  );
}
