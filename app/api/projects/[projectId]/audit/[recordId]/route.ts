import { projectRoute } from "@/lib/api/project-route";
import { auditTrail } from "@/lib/signoff/sign-off";

export const GET = projectRoute<{ projectId: string; recordId: string }>({ action: "project.read" }, ({ user, params }) => auditTrail(user, params.projectId, params.recordId));
