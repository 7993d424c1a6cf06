import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MixForm } from "@/components/mixes/mix-form";
import { MixSummary } from "@/components/mixes/mix-summary";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { getMix, mixFormInput, projectForScreen } from "@/lib/mixes/queries";

export const metadata: Metadata = { title: "Mix design" };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function MixPage({ params }: { params: Promise<{ projectId: string; mixId: string }> }) {
  const { projectId, mixId } = await params;
  const user = await requireUser();
  if (!UUID.test(projectId) || !UUID.test(mixId)) notFound();
  const data = await projectForScreen(await accessTo(user, projectId));
  if (!data) return <Notice tone="danger" title="This project is not available to you." testId="project-forbidden" />;
  const mix = await getMix(data.access, mixId);
  if (!mix) notFound();
  const back = <Link href={`/projects/${projectId}/mixes`} className="underline-offset-4 hover:underline">Mix designs</Link>;
  return (
    <>
      <PageHeader title={mix.code} subtitle={<>{back} · {data.project.name} · version {mix.version}</>} />
      {data.canWriteMixes ? (
        <MixForm projectId={projectId} unitSystem={data.project.unitSystem} mix={mixFormInput(mix)} />
      ) : (
        <MixSummary mix={mix} unitSystem={data.project.unitSystem} />
      )}
    </>
  );
}
