// Query strings of the lab routes, one schema each (messages for a site user).
import { z } from "zod";

export const LAB_STATUSES = ["due", "overdue", "tested"] as const;

export const queueQuerySchema = z.object({
  projectId: z.guid({ error: "Project must be an id" }).optional(),
  status: z
    .string({ error: "Status must be text" })
    .transform((v) => v.split(",").map((s) => s.trim()).filter(Boolean))
    .refine((list) => list.every((s) => (LAB_STATUSES as readonly string[]).includes(s)), {
      message: `Status must be one or more of: ${LAB_STATUSES.join(", ")}`,
    })
    .transform((list) => list as (typeof LAB_STATUSES)[number][])
    .optional(),
});

export const acceptanceQuerySchema = z.object({
  mix: z
    .string({ error: "Mix must be a mix id or code" })
    .trim()
    .min(1, "Mix must be a mix id or code")
    .max(60, "Mix must be a mix id or code")
    .optional(),
});

export const setsQuerySchema = z.object({
  placement: z.guid({ error: "Placement must be an id" }).optional(),
});
