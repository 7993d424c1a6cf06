import { NextResponse } from "next/server";
import type { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { getDigestView, rescheduleSoon } from "@/lib/digest/access";
import { addRecipient, addRecipientSchema } from "@/lib/digest/recipients";

type Params = { projectId: string };

export const GET = projectRoute<Params>({ action: "project.read" }, async ({ access }) => {
  const view = await getDigestView(access);
  return { recipients: view.recipients, digestHour: view.project.digestHour, timeZone: view.project.timeZone };
});

export const POST = projectRoute<Params, z.output<typeof addRecipientSchema>>({ action: "digest.manage", body: addRecipientSchema }, async ({ access, params, body }) => {
  const recipient = await addRecipient(access, body);
  rescheduleSoon(params.projectId);
  return NextResponse.json(recipient, { status: 201 });
});
