// The bodies of a record update and delete (route handlers and the sync push): the version the
// client edited, and the fields to change.
import { z } from "zod";

const baseVersion = z
  .number({ error: "Send the version you edited (baseVersion)" })
  .int("The version must be a whole number")
  .min(1, "The version must be 1 or more")
  .max(1_000_000_000, "That is not a version this record can have");

export const updateBodySchema = z.object({
  baseVersion,
  patch: z.record(z.string(), z.unknown(), { error: "Send the fields to change as an object (patch)" }),
});
export const deleteBodySchema = z.object({ baseVersion });

export type UpdateBody = z.input<typeof updateBodySchema>;
