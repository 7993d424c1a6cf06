import type { NextRequest } from "next/server";
import type { SessionUser } from "@/lib/auth/options";
import type { RecordContext } from "@/lib/records/types";

/** The device a request comes from (the sync client id, when the app sends it), for the audit log. */
export function requestContext(req: NextRequest, user: SessionUser): RecordContext {
  const deviceId = req.headers.get("x-device-id")?.trim().slice(0, 64) || null;
  return { user, deviceId };
}

/** The query string as a plain object (the last value wins for repeated keys). */
export function queryObject(req: NextRequest): Record<string, string> {
  return Object.fromEntries(req.nextUrl.searchParams.entries());
}
