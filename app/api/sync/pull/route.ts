import { apiRoute } from "@/lib/api/handler";
import { pullRequestSchema } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";

export const dynamic = "force-dynamic";

export const POST = apiRoute({ body: pullRequestSchema }, ({ user, body }) => pullChanges(user, body));
