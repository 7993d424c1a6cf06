import { projectRoute } from "@/lib/api/project-route";
import { getDigestHistory } from "@/lib/digest/access";

type Params = { projectId: string };

export const GET = projectRoute<Params>({ action: "digest.manage" }, async ({ access }) => ({ history: await getDigestHistory(access) }));
