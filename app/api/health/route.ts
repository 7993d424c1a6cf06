import { NextResponse } from "next/server";
import { readiness } from "@/lib/health";

export const dynamic = "force-dynamic";

/** The readiness check under its older address and body (scripts and tests wait on it); details at /api/health/ready. */
export async function GET() {
  const result = await readiness();
  const body = { app: result.ready ? "ready" : "unavailable", database: result.checks.database };
  return NextResponse.json(body, { status: result.ready ? 200 : 503 });
}
