import { apiRoute } from "@/lib/api/handler";
import { signOffSchema, type SignOffInput } from "@/lib/signoff/schemas";
import { signOffVisit, verifyVisitSignOff } from "@/lib/site-visits/sign-off";

type Params = { projectId: string; id: string };

/** The visit report's sign-off, whether it still matches what was signed, and the findings still outstanding. */
export const GET = apiRoute<Params>({}, ({ user, params }) => verifyVisitSignOff(user, params.projectId, params.id));

/** Sign a submitted visit report: password, typed name, drawn signature, the version reviewed. */
export const POST = apiRoute<Params, SignOffInput>({ body: signOffSchema }, ({ user, params, body }) => signOffVisit(user, params.projectId, params.id, body));
