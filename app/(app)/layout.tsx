import { redirect } from "next/navigation";
import { SignedInProviders } from "@/components/providers/signed-in-providers";
import { AppShell } from "@/components/shell/app-shell";
import { getSessionUser } from "@/lib/auth/session";
import { readableProjects } from "@/lib/projects/readable";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await getSessionUser();
  if (!user) redirect("/signin");
  const projects = await readableProjects(user);
  return (
    <SignedInProviders>
      <AppShell user={user} projects={projects}>
        {children}
      </AppShell>
    </SignedInProviders>
  );
}
