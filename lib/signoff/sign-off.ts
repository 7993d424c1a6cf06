// The inspector's sign-off of a placed placement: re-entered password, typed name, drawn signature
// and the SHA-256 of the record's content at that moment, stored with the state change in one
// transaction. From then on the database trigger refuses changes; amendments sit beside it.
import { and, asc, desc, eq, getTableColumns } from "drizzle-orm";
import { db } from "@/db";
import { amendments, auditEntries, placements, signOffs, users } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, notFound } from "@/lib/errors";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { checkSigner, recordSignature } from "@/lib/signatures/record";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { assertUuid } from "@/lib/records/guards";
import { inTransaction } from "@/lib/records/write";
import { assertAcknowledged } from "./acknowledge";
import { amendmentsWithSignOffs } from "./amendment-sign";
import { amendmentSchema, signOffSchema } from "./schemas";
import { openItems, placementSnapshot, snapshotHash } from "./snapshot";

function plural(n: number, one: string, many: string) {
  return `${n} ${n === 1 ? one : many}`;
}

export async function signOffPlacement(access: ProjectAccess, placementId: string, input: unknown) {
  const { user, project: { id: projectId } } = access;
  assertUuid(placementId, "Placement");
  const body = parseOrThrow(signOffSchema, input);
  const role = await checkSigner(access, "placement.sign", body.password, { recordType: "placements", recordId: placementId });
  return inTransaction({ user, access }, undefined, async (tx) => {
    const snapshot = await placementSnapshot(tx, projectId, placementId);
    if (!snapshot.placement) throw notFound("Placement");
    const blocking = await openItems(tx, projectId, snapshot);
    const reasons: string[] = [];
    if (blocking.conflicts.length) {
      reasons.push(`${plural(blocking.conflicts.length, "conflict", "conflicts")} to resolve (${[...new Set(blocking.conflicts.map((c) => c.recordType))].join(", ")})`);
    }
    if (blocking.pendingPhotos.length) reasons.push(`${plural(blocking.pendingPhotos.length, "photo", "photos")} still uploading`);
    if (reasons.length) {
      throw conflict(`This placement cannot be signed yet: ${reasons.join(" and ")}.`, {
        reason: "open-items",
        conflicts: blocking.conflicts.map((c) => c.id),
        pendingPhotos: blocking.pendingPhotos.map((p) => p.id),
      });
    }
    const acknowledged = await assertAcknowledged(tx, projectId, snapshot, body.acknowledged);
    const contentHash = snapshotHash(snapshot);
    const signedAt = new Date();
    const placement = await markPlacementSigned({ user, access, tx }, projectId, placementId, { baseVersion: body.baseVersion, signedAt });
    const signOff = await recordSignature(tx, {
      access, role, recordType: "placements", recordId: placementId, body, contentHash, signedAt,
      // The warnings the signer acknowledged stay with the signature (key and the words shown).
      audit: { subject: { placementId }, extra: { acknowledged } },
    });
    return { signOff, placementVersion: placement.version };
  });
}

/** Recomputes the hash and says whether the record still matches what was signed. */
export async function verifyPlacementSignOff(access: ProjectAccess, placementId: string) {
  const projectId = access.project.id;
  assertUuid(placementId, "Placement");
  permit(access, "project.read");
  const [signOff] = await db
    .select({ ...getTableColumns(signOffs), signerName: users.name })
    .from(signOffs)
    .leftJoin(users, eq(users.id, signOffs.signerId))
    .where(and(eq(signOffs.projectId, projectId), eq(signOffs.recordType, "placements"), eq(signOffs.recordId, placementId)))
    .orderBy(desc(signOffs.signedAt))
    .limit(1);
  const [placement] = await db.select({ id: placements.id }).from(placements).where(and(eq(placements.projectId, projectId), eq(placements.id, placementId)));
  if (!placement) throw notFound("Placement");
  const list = await amendmentsWithSignOffs(projectId, placementId);
  if (!signOff) return { signed: false as const, amendments: list };
  const currentHash = snapshotHash(await placementSnapshot(db, projectId, placementId));
  return { signed: true as const, signOff, currentHash, matches: currentHash === signOff.contentHash, amendments: list };
}

/** An amendment beside a signed placement (inspector or office): what changes, why, who, when. */
export async function addAmendment(access: ProjectAccess, placementId: string, input: unknown) {
  const { user, project: { id: projectId } } = access;
  assertUuid(placementId, "Placement");
  const body = parseOrThrow(amendmentSchema, input);
  permit(access, "amendment.write");
  return inTransaction({ user, access }, undefined, async (tx) => {
    const [placement] = await tx.select().from(placements).where(and(eq(placements.projectId, projectId), eq(placements.id, placementId)));
    if (!placement) throw notFound("Placement");
    if (placement.state !== "signed") {
      throw conflict("Only a signed placement takes amendments; correct an unsigned one directly.", { reason: "state" });
    }
    // Looked up within this placement only: an id from another project must not answer with its row.
    const [existing] = await tx
      .select()
      .from(amendments)
      .where(and(eq(amendments.projectId, projectId), eq(amendments.recordId, placementId), eq(amendments.id, body.id)));
    if (existing) return existing; // a retried request
    const [row] = await tx
      .insert(amendments)
      .values({
        id: body.id,
        projectId,
        version: 1,
        changeSeq: await nextChangeSeq(tx, projectId),
        updatedBy: user.id,
        recordType: "placements",
        recordId: placementId,
        what: body.what,
        why: body.why,
        authorId: user.id,
      })
      .onConflictDoNothing()
      .returning();
    if (!row) throw conflict("That amendment id is already in use. Reload and write the amendment again.", { reason: "exists" });
    await writeAudit(tx, { projectId, userId: user.id, recordType: "amendment", recordId: row.id, action: "create", after: row, note: `amends placement ${placementId}` });
    return row;
  });
}

/** Every accepted change of a record, oldest first; readable by every member (owners included). */
export async function auditTrail(access: ProjectAccess, recordId: string) {
  const projectId = access.project.id;
  assertUuid(recordId, "Record");
  permit(access, "project.read");
  return db
    .select({
      id: auditEntries.id,
      at: auditEntries.at,
      action: auditEntries.action,
      recordType: auditEntries.recordType,
      deviceId: auditEntries.deviceId,
      userName: users.name,
      before: auditEntries.before,
      after: auditEntries.after,
      note: auditEntries.note,
    })
    .from(auditEntries)
    .leftJoin(users, eq(users.id, auditEntries.userId))
    .where(and(eq(auditEntries.projectId, projectId), eq(auditEntries.recordId, recordId)))
    .orderBy(asc(auditEntries.id));
}
