// The one error vocabulary of the server. lib/ throws these; lib/api/handler.ts maps them to
// HTTP statuses and the JSON shape { error: { code, message, fields? } }.

export type ErrorCode =
  | "invalid_input"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "unsupported_media_type"
  | "rate_limited"
  | "unavailable";

export const STATUS_BY_CODE: Record<ErrorCode, number> = {
  invalid_input: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  unavailable: 503,
};

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
  }

  get status(): number {
    return STATUS_BY_CODE[this.code];
  }
}

export const invalidInput = (message: string, fields?: Record<string, string>) =>
  new AppError("invalid_input", message, fields);
export const unauthenticated = (message = "Sign in to continue.") => new AppError("unauthenticated", message);
export const forbidden = (message = "You do not have permission to do that on this project.") =>
  new AppError("forbidden", message);
export const notFound = (what = "Record") => new AppError("not_found", `${what} not found.`);
export const conflict = (message: string, details?: Record<string, unknown>) =>
  new AppError("conflict", message, undefined, details);
