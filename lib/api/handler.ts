import { NextResponse, type NextRequest } from "next/server";
import type { ZodType } from "zod";
import { DbRefusal } from "@/db/transaction";
import { requireUser } from "@/lib/auth/session";
import type { SessionUser } from "@/lib/auth/options";
import { AppError } from "@/lib/errors";
import { ConcreteInputError } from "@/lib/concrete/errors";
import { logger } from "@/lib/log";
import { mapDbError } from "@/lib/records/db-errors";
import { parseOrThrow } from "@/lib/validation";
import { checkOrigin, DEFAULT_MAX_BODY_BYTES, readJsonBody } from "./request-guard";

export type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  // A refusal by the database that escaped its write path gets the same words as one inside it.
  if (error instanceof DbRefusal) return errorResponse(mapDbError(error));
  if (error instanceof AppError) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}), ...(error.details ?? {}) } },
      { status: error.status },
    );
  }
  if (error instanceof ConcreteInputError) {
    return NextResponse.json(
      { error: { code: "invalid_input", message: error.message, fields: { [error.field]: error.message } } },
      { status: 400 },
    );
  }
  // Never leak a stack trace or SQL text; log it on the server instead.
  logger.error({ err: error }, "unhandled error in a route handler");
  return NextResponse.json(
    { error: { code: "internal", message: "Something went wrong on the server. Your data was not changed." } },
    { status: 500 },
  );
}

/** The validated body; a route without a body schema still has its body size capped. */
export async function readBody<B>(req: NextRequest, options: { body?: ZodType<B>; maxBodyBytes?: number }): Promise<B> {
  const json = await readJsonBody(req, options.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES);
  return options.body ? parseOrThrow(options.body, json) : (undefined as B);
}

type Ctx<P, B> = { req: NextRequest; user: SessionUser; params: P; body: B };

/**
 * The one wrapper for authenticated route handlers: authenticate → validate → call lib → respond.
 * Authorization against the project happens in lib (it needs the record's project), via lib/auth.
 */
export function apiRoute<P = Record<string, string>, B = undefined>(
  options: { body?: ZodType<B>; maxBodyBytes?: number },
  handler: (ctx: Ctx<P, B>) => Promise<unknown>,
) {
  return async (req: NextRequest, context: { params: Promise<P> }) => {
    try {
      checkOrigin(req);
      const user = await requireUser(req);
      const params = (await context.params) ?? ({} as P);
      const body = await readBody(req, options);
      const result = await handler({ req, user, params, body });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true });
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Same as apiRoute for routes that anyone may call (sign-in link requests, invitations). */
export function publicRoute<B>(
  options: { body?: ZodType<B>; maxBodyBytes?: number },
  handler: (ctx: { req: NextRequest; body: B }) => Promise<unknown>,
) {
  return async (req: NextRequest) => {
    try {
      checkOrigin(req);
      const body = await readBody(req, options);
      const result = await handler({ req, body });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
