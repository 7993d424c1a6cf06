// Query strings of the lab routes, one schema each (messages for a site user).
import { z } from "zod";
import { oneOrMoreOf } from "@/lib/list-query";

export const LAB_STATUSES = ["due", "overdue", "tested"] as const;

export const queueQuerySchema = z.object({
  projectId: z.guid({ error: "Project must be an id" }).optional(),
  status: oneOrMoreOf("Status", LAB_STATUSES).optional(),
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
