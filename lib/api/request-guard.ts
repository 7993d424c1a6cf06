import type { NextRequest } from "next/server";
import { AppError, forbidden, invalidInput } from "@/lib/errors";
import { appOrigin } from "@/lib/mail/transport";

// The request boundary's own checks, applied by every wrapper in lib/api before any lib code runs:
// where a state-changing request comes from, what it carries and how much of it there is.

/** Ordinary JSON bodies (forms, transitions, amendments) are a few kilobytes. */
export const DEFAULT_MAX_BODY_BYTES = 64 * 1024;
/** A sign-off carries a drawn signature (the schema allows 300,000 characters of PNG data URL). */
export const SIGN_OFF_MAX_BODY_BYTES = 400 * 1024;
/** A sync push carries up to 100 mutations (lib/sync/protocol.ts caps each mutation's args). */
export const SYNC_MAX_BODY_BYTES = 2 * 1024 * 1024;

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export const isStateChanging = (req: NextRequest) => !SAFE_METHODS.has(req.method.toUpperCase());

function allowedOrigins(req: NextRequest): Set<string> {
  const origins = new Set<string>([appOrigin()]);
  // The app may also be reached on the host it was asked for (a second local port, a preview).
  origins.add(req.nextUrl.origin);
  return origins;
}

/**
 * CSRF: SameSite=Lax cookies alone let a top-level form POST or a sibling subdomain through.
 * Browsers send Origin (or at least Sec-Fetch-Site) with every state-changing request, so a request
 * from another origin is refused here; a client that sends neither is not a browser and carries no
 * ambient cookie of a victim.
 */
export function checkOrigin(req: NextRequest): void {
  if (!isStateChanging(req)) return;
  const origin = req.headers.get("origin");
  if (origin !== null) {
    if (!allowedOrigins(req).has(origin)) {
      throw forbidden("This request came from another site and was refused. Open the app itself and try again.");
    }
    return;
  }
  const site = req.headers.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none") {
    throw forbidden("This request came from another site and was refused. Open the app itself and try again.");
  }
}

const tooLarge = (maxBytes: number) =>
  new AppError(
    "payload_too_large",
    `The request is too large (the limit is ${Math.round(maxBytes / 1024)} KB). Nothing was saved.`,
  );

/** Reads the body as text, refusing it as soon as it passes maxBytes (a lying Content-Length included). */
export async function readBodyText(req: NextRequest, maxBytes: number): Promise<string> {
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge(maxBytes);
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString("utf8");
}

/** The JSON body, or undefined when there is none; a body must be declared as JSON (no form posts). */
export async function readJsonBody(req: NextRequest, maxBytes: number): Promise<unknown> {
  const text = await readBodyText(req, maxBytes);
  if (!text) return undefined;
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type !== "application/json") {
    throw new AppError("unsupported_media_type", "Send the request as JSON (Content-Type: application/json).");
  }
  try {
    return JSON.parse(text);
  } catch {
    throw invalidInput("The request body is not valid JSON.", { _: "The request body is not valid JSON." });
  }
}
