import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MixForm } from "@/components/mixes/mix-form";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { projectForScreen } from "@/lib/mixes/queries";

export const metadata: Metadata = { title: "New mix design" };

export default async function NewMixPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  const data = await projectForScreen(await accessTo(user, projectId));
  if (!data) return <Notice tone="danger" title="This project is not available to you." testId="project-forbidden" />;
  if (!data.canWriteMixes) {
    return (
      <Notice tone="info" title="Only the office adds mix designs." testId="mix-read-only">
        <Link href={`/projects/${projectId}/mixes`} className="underline">Back to the mix designs</Link>
      </Notice>
    );
  }
  return (
    <>
      <PageHeader title="New mix design" subtitle={`${data.project.name} · values in ${data.project.unitSystem === "IP" ? "inch-pound" : "SI"} units`} />
      <MixForm projectId={projectId} unitSystem={data.project.unitSystem} />
    </>
  );
}
