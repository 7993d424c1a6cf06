"use client";

import { useParams, useRouter } from "next/navigation";
import type { UserProject } from "@/lib/users/queries";

export function ProjectSwitcher({ projects }: { projects: UserProject[] }) {
  const router = useRouter();
  const params = useParams<{ projectId?: string }>();
  if (projects.length === 0) return null;
  return (
    <label className="flex min-w-0 items-center">
      <span className="sr-only">Project</span>
      <select
        data-testid="project-switcher"
        value={params.projectId ?? ""}
        onChange={(e) => e.target.value && router.push(`/projects/${e.target.value}`)}
        className="min-h-11 max-w-[11rem] truncate rounded-md border border-ink-600 bg-ink-800 px-2 text-sm font-semibold text-white sm:max-w-xs"
      >
        <option value="">All my projects</option>
        {projects.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </select>
    </label>
  );
}
