import { NextResponse } from "next/server";
import { sql } from "drizzle-orm";
import { db } from "@/db";

export const dynamic = "force-dynamic";

/** Readiness: the app answers and the database accepts a query. */
export async function GET() {
  try {
    await db.execute(sql`select 1`);
    return NextResponse.json({ app: "ready", database: "ready" });
  } catch {
    return NextResponse.json({ app: "ready", database: "unavailable" }, { status: 503 });
  }
}
