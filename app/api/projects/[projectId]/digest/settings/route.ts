import type { z } from "zod";
import { projectRoute } from "@/lib/api/project-route";
import { rescheduleSoon } from "@/lib/digest/access";
import { projectHourSchema, setProjectDigestHour } from "@/lib/digest/recipients";

type Params = { projectId: string };

/** The project's digest hour (project time zone), the default for every recipient. */
export const PUT = projectRoute<Params, z.output<typeof projectHourSchema>>({ action: "digest.manage", body: projectHourSchema }, async ({ access, params, body }) => {
  await setProjectDigestHour(access, body.digestHour);
  rescheduleSoon(params.projectId);
  return { digestHour: body.digestHour };
});
