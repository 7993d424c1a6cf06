import { redirect } from "next/navigation";
import { AppShell } from "@/components/shell/app-shell";
import { getSessionUser } from "@/lib/auth/session";
import { readableProjects } from "@/lib/projects/readable";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await getSessionUser();
  if (!user) redirect("/signin");
  const projects = await readableProjects(user);
  return (
    <AppShell user={user} projects={projects}>
      {children}
    </AppShell>
  );
}
