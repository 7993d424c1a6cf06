// Errors of the device's write functions, in the same words and shape as the API's
// ({ code, message, fields? }), so a form shows a local refusal exactly like a server one.
import type { z } from "zod";

export type LocalErrorCode = "invalid_input" | "not_found" | "deleted" | "signed" | "state" | "forbidden";

export class LocalWriteError extends Error {
  constructor(
    readonly code: LocalErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = "LocalWriteError";
  }
}

/** Invalid input: nothing was written. `fields` maps a dotted path to its first message. */
export class LocalValidationError extends LocalWriteError {
  declare readonly fields: Record<string, string>;
  constructor(message: string, fields: Record<string, string>) {
    super("invalid_input", message, fields);
    this.name = "LocalValidationError";
  }
}

export function isLocalWriteError(error: unknown): error is LocalWriteError {
  return error instanceof LocalWriteError;
}

/** Field messages keyed by dotted path, as lib/validation.ts zodFields does on the server. */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    fields[key] ??= issue.message;
  }
  return fields;
}

export function validationError(error: z.ZodError): LocalValidationError {
  const fields = fieldMessages(error);
  const first = Object.values(fields)[0];
  return new LocalValidationError(first ?? "The values are not valid.", fields);
}
