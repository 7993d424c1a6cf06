import { apiRoute } from "@/lib/api/handler";
import { pullRequestSchema } from "@/lib/sync/protocol";
import { recordAck } from "@/lib/sync/server/ack";
import { pullBody } from "@/lib/sync/server/pull";

export const dynamic = "force-dynamic";

export const POST = apiRoute({ body: pullRequestSchema }, async ({ user, body }) => {
  await recordAck(user, body.clientId, body.ackedMutationId);
  // The body is JSON assembled around the records' JSON as PostgreSQL built it (lib/sync/server/pull.ts).
  return new Response(await pullBody(user, body), { headers: { "content-type": "application/json" } });
});
