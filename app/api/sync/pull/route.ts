import { apiRoute } from "@/lib/api/handler";
import { pullRequestSchema } from "@/lib/sync/protocol";
import { recordAck } from "@/lib/sync/server/ack";
import { pullChanges } from "@/lib/sync/server/pull";

export const dynamic = "force-dynamic";

export const POST = apiRoute({ body: pullRequestSchema }, async ({ user, body }) => {
  await recordAck(user, body.clientId, body.ackedMutationId);
  return pullChanges(user, body);
});
