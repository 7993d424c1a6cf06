import type { NextRequest } from "next/server";
import type { ProjectAccess } from "@/lib/auth/access";
import type { RecordContext } from "@/lib/records/types";

/**
 * The write context of a project route: the door's access (so lib does not look the role up
 * again) and the device the request comes from (the sync client id, when the app sends it).
 */
export function requestContext(req: NextRequest, access: ProjectAccess): RecordContext {
  const deviceId = req.headers.get("x-device-id")?.trim().slice(0, 64) || null;
  return { user: access.user, access, deviceId };
}

/** The query string as a plain object (the last value wins for repeated keys). */
export function queryObject(req: NextRequest): Record<string, string> {
  return Object.fromEntries(req.nextUrl.searchParams.entries());
}
