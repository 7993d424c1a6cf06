import type { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { rescheduleSoon } from "@/lib/digest/access";
import { removeRecipient, updateRecipient, updateRecipientSchema } from "@/lib/digest/recipients";

type Params = { projectId: string; recipientId: string };

export const PATCH = projectRoute<Params, z.output<typeof updateRecipientSchema>>({ action: "project.read", body: updateRecipientSchema }, async ({ access, params, body }) => {
  const recipient = await updateRecipient(access, params.recipientId, body);
  rescheduleSoon(params.projectId);
  return recipient;
});

export const DELETE = projectRoute<Params>({ action: "digest.manage" }, async ({ access, params }) => {
  await removeRecipient(access, params.recipientId);
  return { ok: true };
});
