// The device's freeze of a signed visit report, apart from the write path (mutate.ts) and the
// lifecycle moves (site-visits.ts), which both call it.
import type { LifecycleType } from "@/lib/site-visits/lifecycle";
import type { SyncDb } from "./db";
import { LocalWriteError } from "./errors";

export const SIGNED_VISIT_LOCAL = "This visit report is signed, so it and its findings cannot be edited; add an amendment instead.";

/** Refuses edits of a signed report and of its findings' observations (the lifecycle goes on). */
export async function assertVisitNotSigned(db: SyncDb, type: LifecycleType, values: Record<string, unknown>) {
  const visit = type === "site-visits" ? values : typeof values.siteVisitId === "string" ? await db.records("site-visits").get(values.siteVisitId) : undefined;
  if (visit?.state === "signed") throw new LocalWriteError("signed", SIGNED_VISIT_LOCAL);
}
