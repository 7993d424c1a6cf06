import { projectRoute } from "@/lib/api/project-route";
import { SIGN_OFF_MAX_BODY_BYTES } from "@/lib/api/request-guard";
import { signAmendment } from "@/lib/signoff/amendment-sign";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";

type Params = { projectId: string; id: string; amendmentId: string };

/** Sign an amendment of a signed placement: password, typed name, drawn signature, the version read. */
export const POST = projectRoute<Params, SignOffInput>({ action: "amendment.write", body: signOffSchema, maxBodyBytes: SIGN_OFF_MAX_BODY_BYTES }, ({ access, params, body }) =>
  signAmendment(access, params.id, params.amendmentId, body),
);
