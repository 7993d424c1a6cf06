// Applies one device mutation through the same write functions as the online API (lib/records,
// lib/placements), inside the push's per-mutation transaction, and turns refusals into results.
import { and, eq, isNull } from "drizzle-orm";
import { z } from "zod";
import type { Transaction } from "@/db";
import { conflicts } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import type { SessionUser } from "@/lib/auth/options";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { ConcreteInputError } from "@/lib/concrete/errors";
import { transitionPlacement } from "@/lib/placements/transition";
import { authorizeIn, type ProjectAccess } from "@/lib/auth/access";
import { writeActions } from "@/lib/records/access";
import { getRecord } from "@/lib/records/read";
import { getRecordDef } from "@/lib/records/registry";
import type { RecordContext, RecordRow } from "@/lib/records/types";
import { createRecord, deleteRecord, updateRecord } from "@/lib/records/write";
import { transitionSiteRecord } from "@/lib/site-visits/transition";
import type { Mutation, MutationOutcome } from "../protocol";

export type Applied = {
  result: MutationOutcome;
  version?: number;
  conflictId?: string;
  reason?: string;
  message?: string;
};

const resolveArgs = z.object({
  conflictId: z.uuid("The conflict id is missing"),
  patch: z.record(z.string(), z.unknown()).default({}),
});

/** Runs the mutation's write; throws the write's own errors (AppError etc.). */
async function write(ctx: RecordContext, m: Mutation): Promise<RecordRow> {
  switch (m.name) {
    case "create":
      return (await createRecord(ctx, m.recordType, m.projectId, { ...m.args, id: m.recordId })).record;
    case "update":
      return updateRecord(ctx, m.recordType, m.projectId, m.recordId, { baseVersion: m.baseVersion, patch: m.args.patch }, { mergeStale: true });
    case "delete":
      return deleteRecord(ctx, m.recordType, m.projectId, m.recordId, { baseVersion: m.baseVersion });
    case "transition":
      if (m.recordType === "site-visits" || m.recordType === "findings") {
        return transitionSiteRecord(ctx, m.recordType, m.projectId, m.recordId, { ...m.args, baseVersion: m.baseVersion ?? 1 }, { fromSync: true });
      }
      if (m.recordType !== "placements") throw new AppError("invalid_input", "Only placements, visit reports and findings change state.");
      return transitionPlacement(ctx, m.projectId, m.recordId, { ...m.args, baseVersion: m.baseVersion });
    case "resolve":
      return resolveConflict(ctx, m);
  }
}

/** A person's answer to a conflict: apply the kept values (if any) and close the conflict. */
async function resolveConflict(ctx: RecordContext, m: Mutation): Promise<RecordRow> {
  const tx = ctx.tx as Transaction;
  const { conflictId, patch } = parseOrThrow(resolveArgs, m.args);
  const [open] = await tx
    .select()
    .from(conflicts)
    .where(and(eq(conflicts.id, conflictId), eq(conflicts.projectId, m.projectId), eq(conflicts.recordId, m.recordId)))
    .for("update");
  if (!open) throw new AppError("not_found", "That conflict was not found on this record.");
  // Whoever sent the conflicting change answers it; anyone else needs the right to write this kind
  // of record, so a reader cannot close it and a non-writer cannot discard the writer's values.
  if (open.createdBy !== ctx.user.id) {
    await authorizeIn(ctx, writeActions(getRecordDef(m.recordType).action), m.projectId, tx);
  }
  const row =
    Object.keys(patch).length > 0
      ? await updateRecord(ctx, m.recordType, m.projectId, m.recordId, { baseVersion: m.baseVersion, patch })
      : // Keeping the server's values of a record deleted meanwhile accepts the deletion.
        await getRecord(ctx, m.recordType, m.projectId, m.recordId, { includeDeleted: true });
  if (!open.resolvedAt) {
    const resolution = { patch, keptServer: Object.keys(patch).length === 0, version: row.version };
    await tx
      .update(conflicts)
      .set({ resolvedAt: new Date(), resolvedBy: ctx.user.id, resolution })
      .where(and(eq(conflicts.id, conflictId), isNull(conflicts.resolvedAt)));
    await writeAudit(tx, {
      projectId: m.projectId,
      userId: ctx.user.id,
      deviceId: ctx.deviceId ?? null,
      recordType: "conflict",
      recordId: conflictId,
      action: "resolve",
      before: { clientPayload: open.clientPayload, serverPayload: open.serverPayload },
      after: resolution,
    });
  }
  return row;
}

/** Reasons that mean "someone else changed it": both payloads are kept as a conflict for a person. */
const CONFLICT_REASONS = new Set(["stale", "exists", "deleted"]);

async function keepConflict(
  tx: Transaction,
  ctx: RecordContext,
  m: Mutation,
  reason: string,
  serverVersion: number | null,
): Promise<string> {
  let serverPayload: RecordRow | null = null;
  try {
    serverPayload = await getRecord({ ...ctx, tx }, m.recordType, m.projectId, m.recordId, { includeDeleted: true });
  } catch {
    serverPayload = null; // the record may not be readable (deleted); the client payload is what matters
  }
  const [row] = await tx
    .insert(conflicts)
    .values({
      projectId: m.projectId,
      recordType: m.recordType,
      recordId: m.recordId,
      baseVersion: m.baseVersion ?? null,
      serverVersion: serverPayload?.version ?? serverVersion,
      clientPayload: { name: m.name, args: m.args },
      serverPayload,
      reason,
      createdBy: ctx.user.id,
    })
    .returning({ id: conflicts.id });
  return row.id;
}

/**
 * Applies `m` as `user` from device `clientId` within `tx`. Permanent refusals become results
 * (rejected, or conflict with both payloads kept); transient failures are thrown for a 503.
 */
export async function applyMutation(
  tx: Transaction,
  user: SessionUser,
  clientId: string,
  m: Mutation,
  access?: ReadonlyMap<string, ProjectAccess>,
): Promise<Applied> {
  const ctx: RecordContext = { user, access, deviceId: clientId, tx };
  try {
    const row = await write(ctx, m);
    return { result: "applied", version: row.version };
  } catch (error) {
    if (error instanceof ConcreteInputError) return { result: "rejected", reason: "invalid", message: error.message };
    if (!(error instanceof AppError)) throw error;
    if (error.code === "unavailable") throw error;
    const reason = typeof error.details?.reason === "string" ? error.details.reason : error.code;
    if (error.code === "conflict" && reason === "signed") {
      // A late edit to a signed record: refused, and kept beside the record for a person to see.
      const conflictId = await keepConflict(tx, ctx, m, "signed", null);
      return { result: "rejected", reason, conflictId, message: error.message };
    }
    if (error.code === "conflict" && CONFLICT_REASONS.has(reason)) {
      const current = typeof error.details?.currentVersion === "number" ? error.details.currentVersion : null;
      const conflictId = await keepConflict(tx, ctx, m, reason, current);
      return { result: "conflict", reason, conflictId, version: current ?? undefined, message: error.message };
    }
    const fields = error.fields ? ` (${Object.entries(error.fields).map(([k, v]) => `${k}: ${v}`).join("; ")})` : "";
    return { result: "rejected", reason: reason === "invalid_input" ? "invalid" : reason, message: `${error.message}${fields}` };
  }
}
