import { apiRoute } from "@/lib/api/handler";
import { getDigestHistory } from "@/lib/digest/access";

type Params = { projectId: string };

export const GET = apiRoute<Params>({}, async ({ user, params }) => ({ history: await getDigestHistory(user, params.projectId) }));
