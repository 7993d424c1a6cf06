import type { Metadata } from "next";
import { ReviewScreen } from "@/components/review/review-screen";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";
import { getReviewViews } from "@/lib/review/views";
import { readableProjects } from "@/lib/projects/readable";

export const metadata: Metadata = { title: "Review" };

export default async function ReviewPage() {
  const user = await requireUser();
  const projects = await readableProjects(user);
  const saved = await getReviewViews(user);
  return (
    <>
      <PageHeader title="Review" subtitle="Placements and daily diaries across your projects, as the field recorded them." />
      <ReviewScreen projects={projects.map((p) => ({ id: p.id, name: p.name, code: p.code }))} saved={saved} />
    </>
  );
}
