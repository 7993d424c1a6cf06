import { projectRoute } from "@/lib/api/project-route";
import { amendmentSchema, type AmendmentInput } from "@/lib/signoff/schemas";
import { addAmendment } from "@/lib/signoff/sign-off";

type Params = { projectId: string; id: string };

export const POST = projectRoute<Params, AmendmentInput>({ action: "amendment.write", body: amendmentSchema }, ({ access, params, body }) =>
  addAmendment(access, params.id, body),
);
