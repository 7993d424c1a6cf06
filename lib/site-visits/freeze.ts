// The signed visit report freezes itself and the observation part of its findings (the database
// trigger of the migration "site-visits-frozen" refuses the same; this gives the friendly answer first).
import { eq } from "drizzle-orm";
import type { Executor } from "@/db";
import { siteVisits } from "@/db/schema";
import { signedVisitConflict } from "@/lib/records/db-errors";

/**
 * 409 when the visit report (`frozenBy` "visit": the row itself) or the report a finding belongs to
 * ("siteVisitId") is signed. The report row is read FOR SHARE, so a sign-off running at the same
 * time waits for this write, or this write sees the signature.
 */
export async function assertVisitNotSigned(tx: Executor, frozenBy: "visit" | "siteVisitId", row: Record<string, unknown>): Promise<void> {
  if (frozenBy === "visit" && row.state === "signed") throw signedVisitConflict();
  const visitId = frozenBy === "visit" ? row.id : row.siteVisitId;
  if (typeof visitId !== "string") return;
  const [visit] = await tx.select({ state: siteVisits.state }).from(siteVisits).where(eq(siteVisits.id, visitId)).for("share");
  if (visit?.state === "signed") throw signedVisitConflict();
}
