// Device writes of the inspection log beyond create/update/delete: a visit report's submit, and a
// finding's answer, close and reopen (mutation "transition", checked again by the server).
import { lifecycleArgsSchema, checkMove, type LifecycleArgs, type LifecycleType } from "@/lib/site-visits/lifecycle";
import type { SyncDb } from "./db";
import { LocalWriteError, validationError } from "./errors";
import { appendEntry, baseVersionFor, loadLive, writeTx, type WriteResult } from "./local-write";
import { rebuildRecord, entriesFor, toWire } from "./replay";
import { SIGNED_VISIT_LOCAL } from "./visit-freeze";

/**
 * Moves a visit report (submit, back to draft) or a finding (answer, close, reopen) through its
 * lifecycle. Refused on the device when the move does not exist from the current state, belongs to
 * another role or lacks its answer or reason; the server checks again.
 */
export async function transitionSiteRecordLocal(
  db: SyncDb,
  type: LifecycleType,
  id: string,
  input: Partial<LifecycleArgs> & { to: string },
): Promise<WriteResult> {
  const parsed = lifecycleArgsSchema.safeParse(input);
  if (!parsed.success) throw validationError(parsed.error);
  const args = toWire(parsed.data);
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, type, id);
    if (type === "site-visits" && row.state === "signed") throw new LocalWriteError("signed", SIGNED_VISIT_LOCAL);
    const project = await db.projects.get(row.projectId);
    const check = checkMove(type, String(row.state), args, project?.role ?? null);
    if (!check.ok) {
      throw new LocalWriteError(check.code, check.message, check.field ? { [check.field]: check.message } : undefined);
    }
    const waiting = await entriesFor(db, type, id);
    const mutationId = await appendEntry(db, {
      name: "transition",
      recordType: type,
      projectId: row.projectId,
      recordId: id,
      args,
      baseVersion: baseVersionFor(row, waiting),
    });
    await rebuildRecord(db, type, id);
    return { id, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}
