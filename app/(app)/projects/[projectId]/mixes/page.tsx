import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { mixTexts } from "@/components/mixes/mix-summary";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { accessTo } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/session";
import { listMixes, projectForScreen } from "@/lib/mixes/queries";
import { Table } from "@/components/ui/table";

export const metadata: Metadata = { title: "Mix designs" };

export default async function MixesPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requireUser();
  if (!/^[0-9a-f-]{36}$/i.test(projectId)) notFound();
  const data = await projectForScreen(await accessTo(user, projectId));
  if (!data) {
    return <Notice tone="danger" title="This project is not available to you." testId="project-forbidden">You are not a member of it.</Notice>;
  }
  const { project, canWriteMixes } = data;
  const mixes = await listMixes(data.access);
  const units = project.unitSystem;
  return (
    <>
      <PageHeader
        title="Mix designs"
        subtitle={<><Link href={`/projects/${projectId}`} className="underline-offset-4 hover:underline">{project.name}</Link> · {units === "IP" ? "inch-pound units" : "SI units"}</>}
        actions={canWriteMixes ? <Link href={`/projects/${projectId}/mixes/new`} className="inline-flex min-h-touch items-center rounded-lg bg-lichen-700 px-4 font-semibold text-white hover:bg-lichen-800" data-testid="new-mix">Add mix</Link> : null}
      />
      {!canWriteMixes ? <p className="mb-3 text-sm text-muted">The office manages mix designs; you can read them here.</p> : null}
      <section className="card overflow-x-auto">
        {mixes.length === 0 ? (
          <p className="p-4 text-muted" data-testid="no-mixes">No mix designs yet.</p>
        ) : (
          <Table columns={["Code", "Supplier", "f′c", "Max w/cm", "Slump", "Air", "Max temp.", "Site water", "Materials"]} testId="mix-table">
              {mixes.map((mix) => {
                const t = mixTexts(mix, units);
                return (
                  <tr key={mix.id} data-testid="mix-row">
                    <td className="px-3 py-2 font-mono font-semibold">
                      <Link href={`/projects/${projectId}/mixes/${mix.id}`} className="text-lichen-700 underline-offset-4 hover:underline">{mix.code}</Link>
                      {mix.lowBleed ? <span className="ml-2 rounded bg-ink-100 px-1.5 py-0.5 font-sans text-xs font-semibold text-ink-800">{t.lowBleed}</span> : null}
                    </td>
                    <td className="px-3 py-2">{mix.supplier || "—"}</td>
                    <td className="px-3 py-2 whitespace-nowrap">{t.strength}</td>
                    <td className="px-3 py-2 font-mono">{t.wcm}</td>
                    <td className="px-3 py-2 whitespace-nowrap">{t.slump}</td>
                    <td className="px-3 py-2">{t.air}</td>
                    <td className="px-3 py-2 whitespace-nowrap">{t.maxTemp}</td>
                    <td className="px-3 py-2 whitespace-nowrap">{t.water}</td>
                    <td className="px-3 py-2">{t.materials}</td>
                  </tr>
                );
              })}
            </Table>
        )}
      </section>
    </>
  );
}
