import { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { updateProjectSpec } from "@/lib/projects/admin";

// The project specification's values; checked in lib against the project's own units.
export const PATCH = projectRoute<{ projectId: string }, Record<string, unknown>>(
  { action: "project.manage", body: z.record(z.string(), z.unknown(), { error: "Send the changed values as an object." }), maxBodyBytes: 4_096 },
  ({ user, project, body }) => updateProjectSpec(user, project, body),
);
