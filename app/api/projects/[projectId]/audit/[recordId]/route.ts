import { projectRoute } from "@/lib/api/project-route";
import { auditTrail } from "@/lib/signoff/sign-off";

export const GET = projectRoute<{ projectId: string; recordId: string }>({ action: "project.read" }, ({ access, params }) => auditTrail(access, params.recordId));
