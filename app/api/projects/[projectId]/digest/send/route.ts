import type { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { sendDigestNow, sendNowSchema } from "@/lib/digest/access";

type Params = { projectId: string };

/** "Send now" from the office: sends the day's digest to whoever has not had it yet. */
export const POST = projectRoute<Params, z.output<typeof sendNowSchema>>({ action: "digest.manage", body: sendNowSchema }, ({ access, body }) =>
  sendDigestNow(access, body.date),
);
