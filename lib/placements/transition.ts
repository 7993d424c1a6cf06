// Moving a placement through its workflow; the generic record update never changes the state.
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import type { Executor } from "@/db";
import { placements } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, forbidden } from "@/lib/errors";
import { accessIn, allows, permit } from "@/lib/auth/access";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { signedConflict } from "@/lib/records/db-errors";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { assertUuid, lockRecord } from "@/lib/records/guards";
import { getRecordDef } from "@/lib/records/registry";
import type { RecordContext, RecordRow } from "@/lib/records/types";
import { inTransaction } from "@/lib/records/write";
import { describeAllowed, describeForbidden, findTransition, TRANSITIONS, type PlacementState } from "./workflow";

export const transitionSchema = z
  .object({
    to: z.enum(PLACEMENT_STATES, { error: `The new state must be one of: ${PLACEMENT_STATES.join(", ")}` }),
    reason: z.string({ error: "The reason must be text" }).trim().max(1_000, "The reason can be at most 1000 characters").optional(),
    baseVersion: z
      .number({ error: "Send the version you saw (baseVersion)" })
      .int("The version must be a whole number")
      .min(1, "The version must be 1 or more")
      .max(1_000_000_000, "That is not a version this record can have"),
  })
  .superRefine((v, ctx) => {
    if (v.to === "held" && !v.reason) {
      ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the placement is held" });
    }
  });
export type TransitionInput = z.input<typeof transitionSchema>;

const ANY_TRANSITION = [...new Set(TRANSITIONS.map((t) => t.action))];

/** Writes a state change of a locked placement row: version, change number and audit entry. */
export async function writeStateChange(
  tx: Executor,
  ctx: RecordContext,
  placement: RecordRow,
  set: { state: PlacementState } & Partial<{ holdReason: string | null; signedAt: Date; signedBy: string }>,
  note: string,
): Promise<RecordRow> {
  const changeSeq = await nextChangeSeq(tx, placement.projectId);
  const [row] = (await tx
    .update(placements)
    .set({ ...set, version: placement.version + 1, changeSeq, updatedAt: new Date(), updatedBy: ctx.user.id })
    .where(and(eq(placements.id, placement.id), eq(placements.projectId, placement.projectId)))
    .returning()) as RecordRow[];
  await writeAudit(tx, {
    projectId: placement.projectId,
    userId: ctx.user.id,
    deviceId: ctx.deviceId ?? null,
    recordType: "placements",
    recordId: placement.id,
    action: "transition",
    before: placement,
    after: row,
    note,
  });
  return row;
}

/**
 * Moves a placement to `to` if the workflow allows it for the caller's role. An illegal move is a
 * 409 naming the moves allowed now; a move that belongs to another role is a 403. The sign-off is
 * not a plain state change (markPlacementSigned), and a signed placement never changes.
 */
export async function transitionPlacement(
  ctx: RecordContext,
  projectId: string,
  id: string,
  input: unknown,
): Promise<RecordRow> {
  const def = getRecordDef("placements");
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  const { to, reason, baseVersion } = parseOrThrow(transitionSchema, input);
  return inTransaction(ctx, def, async (tx) => {
    const access = await accessIn(ctx, projectId, tx);
    permit(access, ANY_TRANSITION);
    const placement = await lockRecord(tx, def, projectId, id);
    if (placement.deletedAt) throw conflict("This placement was deleted.", { reason: "deleted", currentVersion: placement.version });
    const from = placement.state as PlacementState;
    if (from === "signed") throw signedConflict();
    const transition = findTransition(from, to);
    if (!transition) throw conflict(describeAllowed(from), { reason: "state", allowed: TRANSITIONS.filter((t) => t.from === from).map((t) => t.to) });
    if (!allows(access, transition.action)) {
      throw forbidden(describeForbidden(transition));
    }
    if (to === "signed") {
      throw conflict("A placement is signed through the sign-off (typed name, signature and password), not by a state change.", {
        reason: "state",
      });
    }
    if (placement.version !== baseVersion) {
      throw conflict(
        `This placement was changed by someone else since you opened it (it is now version ${placement.version}). Reload it and try again.`,
        { reason: "stale", currentVersion: placement.version },
      );
    }
    const holdReason = to === "held" ? (reason ?? null) : null;
    return writeStateChange(tx, ctx, placement, { state: to, holdReason }, `${from} → ${to}${reason ? `: ${reason}` : ""}`);
  });
}
