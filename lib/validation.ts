// Validation with the schemas' own (site-user) messages. No framework import: domain code, the
// sync path and the seed call it; the HTTP adapter (lib/api) only maps the AppError it throws.
import type { z, ZodType } from "zod";
import { invalidInput } from "@/lib/errors";

/** Field errors keyed by dotted path, with the schema's own (site-user) messages. */
export function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    fields[key] ??= issue.message;
  }
  return fields;
}

/** The parsed value, or an `invalid_input` AppError naming the first field and listing them all. */
export function parseOrThrow<T>(schema: ZodType<T>, input: unknown): T {
  const result = schema.safeParse(input);
  if (!result.success) {
    const fields = zodFields(result.error);
    const first = Object.entries(fields)[0];
    throw invalidInput(first ? first[1] : "The request is not valid.", fields);
  }
  return result.data;
}
