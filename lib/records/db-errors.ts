// Postgres errors a write can meet (classified by db/transaction.ts), turned into the app's error
// vocabulary (lib/errors). With a record definition the message names the record type.
import { dbRefusal, FROZEN_SQLSTATE } from "@/db/transaction";
import { AppError, conflict } from "@/lib/errors";
import { PHOTO_SIGNED_MESSAGE } from "@/lib/photos/rules";
import type { RecordDef } from "./registry";

/** SQLSTATE raised by the signed-records trigger (drizzle/0002_signed-records-frozen.sql). */
export const SIGNED_SQLSTATE = FROZEN_SQLSTATE;
export const SIGNED_MESSAGE = "This placement is signed; add an amendment instead.";

export const signedConflict = () => conflict(SIGNED_MESSAGE, { reason: "signed" });
export const SIGNED_VISIT_MESSAGE = "This visit report is signed; add an amendment instead, or record new findings on a new visit.";
export const signedVisitConflict = () => conflict(SIGNED_VISIT_MESSAGE, { reason: "signed" });

export const MIX_FROZEN_MESSAGE =
  "A signed placement was judged against this mix, so it can no longer be changed or removed. Add the revised design as a new mix with its own code and choose it for the coming placements.";

export function mapDbError(error: unknown, def?: RecordDef): unknown {
  if (error instanceof AppError) return error;
  const refusal = dbRefusal(error);
  if (!refusal) return error;
  if (refusal.kind === "frozen") {
    // drizzle/0015: the mix of a signed placement.
    if (def?.type === "mix-designs") return conflict(MIX_FROZEN_MESSAGE, { reason: "signed" });
    if (def?.frozenBy === "record") return conflict(PHOTO_SIGNED_MESSAGE, { reason: "signed" });
    return def?.frozenBy === "visit" || def?.frozenBy === "siteVisitId" ? signedVisitConflict() : signedConflict();
  }
  if (refusal.kind === "duplicate") {
    if (def?.unique && refusal.constraint === def.unique.index) {
      return new AppError("conflict", def.unique.message, { [def.unique.field]: def.unique.message }, { reason: "duplicate" });
    }
    return conflict("A record with this id already exists.", { reason: "duplicate" });
  }
  // Serialization failures and deadlocks are transient: the caller (or the device) retries.
  return new AppError("unavailable", "The server was busy with the same records; try again.");
}
