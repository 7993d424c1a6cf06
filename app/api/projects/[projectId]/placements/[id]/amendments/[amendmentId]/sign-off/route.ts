import { apiRoute } from "@/lib/api/handler";
import { signAmendment } from "@/lib/signoff/amendment-sign";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";

type Params = { projectId: string; id: string; amendmentId: string };

/** Sign an amendment of a signed placement: password, typed name, drawn signature, the version read. */
export const POST = apiRoute<Params, SignOffInput>({ body: signOffSchema }, ({ user, params, body }) =>
  signAmendment(user, params.projectId, params.id, params.amendmentId, body),
);
