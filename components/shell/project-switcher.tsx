"use client";

import { useParams, useRouter } from "next/navigation";
import { ProjectPicker } from "@/components/ui/project-picker";
import type { UserProject } from "@/lib/users/queries";

export function ProjectSwitcher({ projects }: { projects: UserProject[] }) {
  const router = useRouter();
  const params = useParams<{ projectId?: string }>();
  if (projects.length === 0) return null;
  return (
    <ProjectPicker
      look="header"
      testId="project-switcher"
      projects={projects}
      value={params.projectId ?? ""}
      onChange={(id) => id && router.push(`/projects/${id}`)}
      className="max-w-[11rem]"
    />
  );
}
