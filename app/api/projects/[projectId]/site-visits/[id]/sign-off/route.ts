import { projectRoute } from "@/lib/api/project-route";
import { SIGN_OFF_MAX_BODY_BYTES } from "@/lib/api/request-guard";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";
import { signOffVisit, verifyVisitSignOff } from "@/lib/site-visits/sign-off";

type Params = { projectId: string; id: string };

/** The visit report's sign-off, whether it still matches what was signed, and the findings still outstanding. */
export const GET = projectRoute<Params>({ action: "project.read" }, ({ access, params }) => verifyVisitSignOff(access, params.id));

/** Sign a submitted visit report: password, typed name, drawn signature, the version reviewed. */
export const POST = projectRoute<Params, SignOffInput>({ action: "visit.sign", body: signOffSchema, maxBodyBytes: SIGN_OFF_MAX_BODY_BYTES }, ({ access, params, body }) => signOffVisit(access, params.id, body));
