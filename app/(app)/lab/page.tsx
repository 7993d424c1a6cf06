import type { Metadata } from "next";
import { LabQueueTable } from "@/components/lab/lab-queue";
import { PageHeader } from "@/components/ui/page-header";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Lab queue" };

export default async function LabPage() {
  await requireUser();
  return (
    <>
      <PageHeader title="Lab queue" subtitle="Specimen sets made in the field, each planned test age listed by the day it is due (cast time + age)." />
      <LabQueueTable />
    </>
  );
}
