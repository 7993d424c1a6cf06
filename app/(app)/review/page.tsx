import type { Metadata } from "next";
import { ReviewScreen } from "@/components/review/review-screen";
import { PageHeader } from "@/components/ui/page-header";
import { can } from "@/lib/auth/can";
import { requireUser } from "@/lib/auth/session";
import { getReviewViews } from "@/lib/review/views";
import { listUserProjects } from "@/lib/users/queries";

export const metadata: Metadata = { title: "Review" };

export default async function ReviewPage() {
  const user = await requireUser();
  const projects = (await listUserProjects(user.id)).filter((p) => can(user, "project.read", p.role));
  const saved = await getReviewViews(user);
  return (
    <>
      <PageHeader title="Review" subtitle="Placements and daily diaries across your projects, as the field recorded them." />
      <ReviewScreen projects={projects.map((p) => ({ id: p.id, name: p.name, code: p.code }))} saved={saved} />
    </>
  );
}
