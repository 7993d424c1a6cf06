import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { can } from "@/lib/auth/can";
import { requireUser } from "@/lib/auth/session";

export default async function AdminLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  if (!can(user, "admin.users", null)) {
    return <Notice tone="danger" title="Administrators only." testId="admin-forbidden">Your account cannot manage users or projects.</Notice>;
  }
  return (
    <>
      <nav aria-label="Admin" className="mb-4 flex gap-2">
        <Link href="/admin" className="rounded-md bg-white px-3 py-2 text-sm font-semibold ring-1 ring-ink-200 hover:bg-ink-50">People</Link>
        <Link href="/admin/projects" className="rounded-md bg-white px-3 py-2 text-sm font-semibold ring-1 ring-ink-200 hover:bg-ink-50">Projects</Link>
      </nav>
      {children}
    </>
  );
}
