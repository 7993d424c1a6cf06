import { apiRoute } from "@/lib/api/handler";
import { auditTrail } from "@/lib/signoff/sign-off";

export const GET = apiRoute<{ projectId: string; recordId: string }>({}, ({ user, params }) => auditTrail(user, params.projectId, params.recordId));
