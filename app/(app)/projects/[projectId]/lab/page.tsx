import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { LabWorkspace } from "@/components/lab/lab-workspace";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { getProjectForMember } from "@/lib/projects/queries";

export const metadata: Metadata = { title: "Lab results" };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function ProjectLabPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ placement?: string }> }) {
  const { projectId } = await params;
  const { placement } = await searchParams;
  const user = await requireUser();
  if (!UUID.test(projectId)) notFound();
  let project;
  try {
    ({ project } = await getProjectForMember(await accessTo(user, projectId)));
  } catch (error) {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "forbidden")) {
      return <Notice tone="danger" title="This project is not available to you." testId="project-forbidden">You are not a member of it.</Notice>;
    }
    throw error;
  }
  return (
    <>
      <PageHeader
        title="Lab results"
        subtitle={<><Link href={`/projects/${projectId}`} className="underline-offset-4 hover:underline">{project.name}</Link> · {project.unitSystem === "IP" ? "inch-pound units" : "SI units"} · <Link href="/lab" className="underline-offset-4 hover:underline">lab queue</Link></>}
      />
      <LabWorkspace projectId={projectId} placementId={placement && UUID.test(placement) ? placement : null} unitSystem={project.unitSystem} timeZone={project.timeZone} />
    </>
  );
}
