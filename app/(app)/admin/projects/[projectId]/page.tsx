import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MemberManager } from "@/components/admin/member-manager";
import { ProjectSpecForm } from "@/components/admin/project-spec-form";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { getProjectForAdmin, projectSpec } from "@/lib/projects/admin";

export const metadata: Metadata = { title: "Project settings" };

export default async function AdminProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  const data = await getProjectForAdmin(user, projectId).catch((error) => {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  });
  return (
    <>
      <PageHeader title={data.project.name} subtitle={`${data.project.code} · members, roles and specification`} />
      <div className="flex flex-col gap-6">
        <MemberManager projectId={projectId} members={data.members} />
        <ProjectSpecForm projectId={projectId} unitSystem={data.project.unitSystem} spec={projectSpec(data.project)} />
      </div>
    </>
  );
}
