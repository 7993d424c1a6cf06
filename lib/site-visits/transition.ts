// Moving a visit report or a finding through its lifecycle (lib/site-visits/lifecycle.ts), for the
// route handlers and the sync push alike. The generic record update never changes these states.
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { siteVisits } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, forbidden, invalidInput } from "@/lib/errors";
import { authorizeIn } from "@/lib/auth/access";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { signedVisitConflict } from "@/lib/records/db-errors";
import { assertUuid, lockRecord } from "@/lib/records/guards";
import { getRecordDef } from "@/lib/records/registry";
import type { RecordContext, RecordRow } from "@/lib/records/types";
import { inTransaction } from "@/lib/records/write";
import { checkMove, FINDING_MOVES, lifecycleArgsSchema, moveEffect, VISIT_MOVES, type LifecycleType } from "./lifecycle";

export const lifecycleBodySchema = lifecycleArgsSchema.extend({
  baseVersion: z
    .number({ error: "Send the version you saw (baseVersion)" })
    .int("The version must be a whole number")
    .min(1, "The version must be 1 or more")
    .max(1_000_000_000, "That is not a version this record can have"),
});
export type LifecycleBody = z.input<typeof lifecycleBodySchema>;

const ACTIONS = { "site-visits": [...new Set(VISIT_MOVES.map((m) => m.action))], findings: [...new Set(FINDING_MOVES.map((m) => m.action))] };

export type LifecycleOptions = {
  /**
   * For the sync push: a move made on an older version still applies when the record is in the
   * state the move starts from. The lifecycle fields are disjoint from the observation the
   * inspector may have edited meanwhile, and the state decides whether the move makes sense.
   */
  fromSync?: boolean;
};

/**
 * Applies a lifecycle move. A move that does not exist from the current state is a 409 naming the
 * moves allowed; one that belongs to another role is a 403; a missing answer or reason is a 400.
 * Findings of a signed report go on answering, closing and reopening: the signature covers what
 * the inspector observed and required, and the follow-up has its own audit trail.
 */
export async function transitionSiteRecord(
  ctx: RecordContext,
  type: LifecycleType,
  projectId: string,
  id: string,
  input: unknown,
  options: LifecycleOptions = {},
): Promise<RecordRow> {
  const def = getRecordDef(type);
  assertUuid(projectId, "Project");
  assertUuid(id, def.label);
  const { baseVersion, ...args } = parseOrThrow(lifecycleBodySchema, input);
  return inTransaction(ctx, def, async (tx) => {
    const role = await authorizeIn(ctx, ACTIONS[type], projectId, tx);
    const row = await lockRecord(tx, def, projectId, id);
    const noun = def.label.toLowerCase();
    if (row.deletedAt) throw conflict(`This ${noun} was deleted.`, { reason: "deleted", currentVersion: row.version });
    if (type === "site-visits" && row.state === "signed") throw signedVisitConflict();
    if (type === "findings") {
      const [visit] = await tx
        .select({ deletedAt: siteVisits.deletedAt })
        .from(siteVisits)
        .where(and(eq(siteVisits.id, row.siteVisitId as string), eq(siteVisits.projectId, projectId)))
        .for("share");
      if (!visit || visit.deletedAt) throw conflict("The visit report of this finding was deleted.", { reason: "deleted" });
    }
    const from = String(row.state);
    const check = checkMove(type, from, args, role);
    if (!check.ok) {
      if (check.code === "forbidden") throw forbidden(check.message);
      if (check.code === "invalid_input") throw invalidInput(check.message, { [check.field ?? "to"]: check.message });
      throw conflict(check.message, { reason: "state" });
    }
    if (row.version !== baseVersion && !options.fromSync) {
      throw conflict(`This ${noun} was changed by someone else since you opened it (it is now version ${row.version}). Reload it and try again.`, {
        reason: "stale",
        currentVersion: row.version,
      });
    }
    const effect = moveEffect(type, check.move, args, ctx.user.id, new Date());
    const changeSeq = await nextChangeSeq(tx, projectId);
    const [updated] = (await tx
      .update(def.table)
      .set({ ...effect, version: row.version + 1, changeSeq, updatedAt: new Date(), updatedBy: ctx.user.id } as never)
      .where(and(eq(def.table.id, id), eq(def.table.projectId, projectId)))
      .returning()) as RecordRow[];
    const text = args.response ?? args.reason ?? args.note;
    await writeAudit(tx, {
      projectId,
      userId: ctx.user.id,
      deviceId: ctx.deviceId ?? null,
      recordType: type,
      recordId: id,
      action: "transition",
      before: row,
      after: updated,
      note: `${from} → ${check.move.to}${text ? `: ${text}` : ""}`,
    });
    return updated;
  });
}


