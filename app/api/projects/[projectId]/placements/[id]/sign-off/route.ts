import { projectRoute } from "@/lib/api/project-route";
import { SIGN_OFF_MAX_BODY_BYTES } from "@/lib/api/request-guard";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";
import { signOffPlacement, verifyPlacementSignOff } from "@/lib/signoff/sign-off";

type Params = { projectId: string; id: string };

/** The sign-off and whether the record still matches what was signed. */
export const GET = projectRoute<Params>({ action: "project.read" }, ({ access, params }) => verifyPlacementSignOff(access, params.id));

/** Sign a placed placement: password, typed name, drawn signature, the version reviewed. */
export const POST = projectRoute<Params, SignOffInput>({ action: "placement.sign", body: signOffSchema, maxBodyBytes: SIGN_OFF_MAX_BODY_BYTES }, ({ access, params, body }) =>
  signOffPlacement(access, params.id, body),
);
