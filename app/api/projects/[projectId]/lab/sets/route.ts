import { apiRoute } from "@/lib/api/handler";
import { getProjectSets } from "@/lib/lab/queries";
import { queryObject } from "@/lib/records/request";

export const GET = apiRoute<{ projectId: string }>({}, ({ req, user, params }) =>
  getProjectSets(user, params.projectId, queryObject(req)),
);
