// A placement's move through its workflow on the device (mutation "transition").
import { z } from "zod";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { describeAllowed, describeForbidden, findTransition, rolesFor, type PlacementState } from "@/lib/placements/workflow";
import type { SyncDb } from "./db";
import { LocalWriteError } from "./errors";
import { appendEntry, baseVersionFor, loadLive, parseOrThrow, writeTx, type WriteResult } from "./local-write";
import { entriesFor, rebuildRecord, toWire } from "./replay";

/** Arguments of a placement transition (mutation "transition"). The sign-off is not a transition. */
export const transitionArgsSchema = z
  .object({
    to: z.enum(PLACEMENT_STATES, { error: `The new state must be one of: ${PLACEMENT_STATES.join(", ")}` }),
    reason: z.string({ error: "The reason must be text" }).trim().max(1_000, "The reason can be at most 1000 characters").optional(),
  })
  .superRefine((v, ctx) => {
    if (v.to === "held" && !v.reason) ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the placement is held" });
  });

/**
 * Moves a placement through its workflow (lib/placements/workflow). Refused on the device when the
 * move does not exist from the current state, or belongs to another role on the project; the server
 * checks again.
 */
export async function transitionLocal(db: SyncDb, placementId: string, to: PlacementState, reason?: string): Promise<WriteResult> {
  const args = toWire(parseOrThrow(transitionArgsSchema, { to, reason: reason || undefined }));
  const result = await writeTx(db, async () => {
    const row = await loadLive(db, "placements", placementId);
    const from = row.state as PlacementState;
    if (from === "signed") {
      throw new LocalWriteError("signed", "This placement is signed, so it cannot change state. Ask the office for an amendment.");
    }
    if (args.to === "signed") {
      throw new LocalWriteError("state", "A placement is signed through the sign-off (typed name, signature and password), not by a state change.");
    }
    const transition = findTransition(from, args.to);
    if (!transition) throw new LocalWriteError("state", describeAllowed(from));
    const project = await db.projects.get(row.projectId);
    if (project && !rolesFor(transition).includes(project.role)) {
      throw new LocalWriteError("forbidden", describeForbidden(transition));
    }
    const waiting = await entriesFor(db, "placements", placementId);
    const mutationId = await appendEntry(db, {
      name: "transition",
      recordType: "placements",
      projectId: row.projectId,
      recordId: placementId,
      args,
      baseVersion: baseVersionFor(row, waiting),
    });
    await rebuildRecord(db, "placements", placementId);
    return { id: placementId, mutationId, merged: false };
  });
  db.notifyLocalWrite();
  return result;
}
