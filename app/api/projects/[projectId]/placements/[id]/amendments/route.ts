import { apiRoute } from "@/lib/api/handler";
import { amendmentSchema, type AmendmentInput } from "@/lib/signoff/schemas";
import { addAmendment } from "@/lib/signoff/sign-off";

type Params = { projectId: string; id: string };

export const POST = apiRoute<Params, AmendmentInput>({ body: amendmentSchema }, ({ user, params, body }) =>
  addAmendment(user, params.projectId, params.id, body),
);
