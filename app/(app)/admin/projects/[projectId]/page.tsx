import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MemberManager } from "@/components/admin/member-manager";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { getProjectForAdmin } from "@/lib/projects/admin";

export const metadata: Metadata = { title: "Project members" };

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
      <PageHeader title={data.project.name} subtitle={`${data.project.code} · members and roles`} />
      <MemberManager projectId={projectId} members={data.members} />
    </>
  );
}
