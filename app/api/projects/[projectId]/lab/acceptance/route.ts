import { projectRoute } from "@/lib/api/project-route";
import { getProjectAcceptance } from "@/lib/lab/queries";
import { queryObject } from "@/lib/api/request";

export const GET = projectRoute<{ projectId: string }>({ action: "project.read" }, ({ req, access }) =>
  getProjectAcceptance(access, queryObject(req)),
);
