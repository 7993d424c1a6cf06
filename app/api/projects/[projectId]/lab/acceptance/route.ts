import { apiRoute } from "@/lib/api/handler";
import { getProjectAcceptance } from "@/lib/lab/queries";
import { queryObject } from "@/lib/records/request";

export const GET = apiRoute<{ projectId: string }>({}, ({ req, user, params }) =>
  getProjectAcceptance(user, params.projectId, queryObject(req)),
);
