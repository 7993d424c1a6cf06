import { apiRoute } from "@/lib/api/handler";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";
import { signOffPlacement, verifyPlacementSignOff } from "@/lib/signoff/sign-off";

type Params = { projectId: string; id: string };

/** The sign-off and whether the record still matches what was signed. */
export const GET = apiRoute<Params>({}, ({ user, params }) => verifyPlacementSignOff(user, params.projectId, params.id));

/** Sign a placed placement: password, typed name, drawn signature, the version reviewed. */
export const POST = apiRoute<Params, SignOffInput>({ body: signOffSchema }, ({ user, params, body }) =>
  signOffPlacement(user, params.projectId, params.id, body),
);
