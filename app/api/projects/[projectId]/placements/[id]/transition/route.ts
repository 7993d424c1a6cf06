import { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { transitionPlacement } from "@/lib/placements/transition";
import { requestContext } from "@/lib/api/request";

type Params = { projectId: string; id: string };

// Body { to, reason?, baseVersion }, validated in lib.
export const POST = projectRoute<Params, unknown>({ action: "project.read", body: z.unknown() }, ({ req, access, params, body }) =>
  transitionPlacement(requestContext(req, access), params.projectId, params.id, body),
);
