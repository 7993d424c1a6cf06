import { NextResponse } from "next/server";

export const dynamic = "force-dynamic";

/** Liveness: the process answers. No database check, so an outage does not restart every instance. */
export function GET() {
  return NextResponse.json({ live: true });
}
