import type { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { rescheduleSoon } from "@/lib/digest/access";
import { removeRecipient, updateRecipient, updateRecipientSchema } from "@/lib/digest/recipients";

type Params = { projectId: string; recipientId: string };

export const PATCH = projectRoute<Params, z.output<typeof updateRecipientSchema>>({ action: "project.read", body: updateRecipientSchema }, async ({ user, params, body }) => {
  const recipient = await updateRecipient(user, params.projectId, params.recipientId, body);
  rescheduleSoon(params.projectId);
  return recipient;
});

export const DELETE = projectRoute<Params>({ action: "digest.manage" }, async ({ user, params }) => {
  await removeRecipient(user, params.projectId, params.recipientId);
  return { ok: true };
});
