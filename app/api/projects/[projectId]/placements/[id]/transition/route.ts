import { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { transitionPlacement } from "@/lib/placements/transition";
import { requestContext } from "@/lib/records/request";

type Params = { projectId: string; id: string };

// Body { to, reason?, baseVersion }, validated in lib.
export const POST = apiRoute<Params, unknown>({ body: z.unknown() }, ({ req, user, params, body }) =>
  transitionPlacement(requestContext(req, user), params.projectId, params.id, body),
);
