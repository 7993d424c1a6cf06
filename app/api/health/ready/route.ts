import { NextResponse } from "next/server";
import { readiness } from "@/lib/health";

export const dynamic = "force-dynamic";

/** Readiness: 503 while shutting down, while the database is unreachable or migrations are pending. */
export async function GET() {
  const result = await readiness();
  return NextResponse.json(result, { status: result.ready ? 200 : 503 });
}
