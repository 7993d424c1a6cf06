import type { z } from "zod";
import { apiRoute } from "@/lib/api/handler";
import { rescheduleSoon } from "@/lib/digest/access";
import { removeRecipient, updateRecipient, updateRecipientSchema } from "@/lib/digest/recipients";

type Params = { projectId: string; recipientId: string };

export const PATCH = apiRoute<Params, z.output<typeof updateRecipientSchema>>({ body: updateRecipientSchema }, async ({ user, params, body }) => {
  const recipient = await updateRecipient(user, params.projectId, params.recipientId, body);
  rescheduleSoon(params.projectId);
  return recipient;
});

export const DELETE = apiRoute<Params>({}, async ({ user, params }) => {
  await removeRecipient(user, params.projectId, params.recipientId);
  return { ok: true };
});
