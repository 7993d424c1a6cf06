import type { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { sendDigestNow, sendNowSchema } from "@/lib/digest/access";

type Params = { projectId: string };

/** "Send now" from the office: sends the day's digest to whoever has not had it yet. */
export const POST = apiRoute<Params, z.output<typeof sendNowSchema>>({ body: sendNowSchema }, ({ user, params, body }) =>
  sendDigestNow(user, params.projectId, body.date),
);
