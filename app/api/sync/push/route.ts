import { NextResponse } from "next/server";
import { apiRoute } from "@/lib/api/handler";
import { SYNC_MAX_BODY_BYTES } from "@/lib/api/request-guard";
import { AppError } from "@/lib/errors";
import { pushRequestSchema } from "@/lib/sync/protocol";
import { isTransient, pushMutations } from "@/lib/sync/server/push";

export const dynamic = "force-dynamic";

export const POST = apiRoute({ body: pushRequestSchema, maxBodyBytes: SYNC_MAX_BODY_BYTES }, async ({ user, body }) => {
  try {
    return await pushMutations(user, body);
  } catch (error) {
    // Nothing after the failed mutation was applied; the device keeps it and retries.
    if (!(error instanceof AppError) && isTransient(error)) {
      return NextResponse.json(
        { error: { code: "unavailable", message: "The server could not save right now. Your changes are kept on the device and will be sent again." } },
        { status: 503, headers: { "retry-after": "5" } },
      );
    }
    throw error;
  }
});
