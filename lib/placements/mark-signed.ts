// The state change at the heart of the sign-off (placed → signed). The sign-off itself
// (lib/signoff/sign-off.ts signOffPlacement: typed name, drawn signature, re-entered password,
// sign_offs row) calls it in the same transaction via ctx.tx.
import { conflict } from "@/lib/errors";
import { authorizeIn } from "@/lib/auth/access";
import { signedConflict } from "@/lib/records/db-errors";
import { assertUuid, lockRecord } from "@/lib/records/guards";
import { getRecordDef } from "@/lib/records/registry";
import type { RecordContext, RecordRow } from "@/lib/records/types";
import { inTransaction } from "@/lib/records/write";
import { writeStateChange } from "./transition";
import { describeAllowed, type PlacementState } from "./workflow";

/**
 * Signs a placed placement (inspector, "placement.sign"), only against the version the signer saw
 * (SYNC.md "Sign-off"). From then on the database refuses changes to it and its records.
 */
export async function markPlacementSigned(
  ctx: RecordContext,
  projectId: string,
  id: string,
  { baseVersion, signedAt = new Date() }: { baseVersion: number; signedAt?: Date },
): Promise<RecordRow> {
  const def = getRecordDef("placements");
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  return inTransaction(ctx, def, async (tx) => {
    await authorizeIn(ctx, "placement.sign", projectId, tx);
    const placement = await lockRecord(tx, def, projectId, id);
    if (placement.deletedAt) throw conflict("This placement was deleted.", { reason: "deleted" });
    if (placement.state === "signed") throw signedConflict();
    if (placement.state !== "placed") {
      throw conflict(`Only a placed placement can be signed. ${describeAllowed(placement.state as PlacementState)}`, { reason: "state" });
    }
    if (placement.version !== baseVersion) {
      throw conflict(`The placement changed since you reviewed it (it is now version ${placement.version}). Review it again before signing.`, {
        reason: "stale",
        currentVersion: placement.version,
      });
    }
    return writeStateChange(tx, ctx, placement, { state: "signed", signedAt, signedBy: ctx.user.id }, "placed → signed");
  });
}
