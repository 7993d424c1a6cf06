// What the office sees of one placement: everything the field recorded (the sign-off snapshot's
// records), the mix, the digest's warnings for this placement, sign-offs, amendments and conflicts.
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { amendments, conflicts, mixDesigns, signOffs, users } from "@/db/schema";
import { allows, permit, type ProjectAccess } from "@/lib/auth/access";
import { localDate } from "@/lib/time/zone";
import { notFound } from "@/lib/errors";
import { assertUuid } from "@/lib/records/guards";
import { placementSnapshot } from "@/lib/signoff/snapshot";
import { placementWarnings } from "./placement-findings";

type Row = Record<string, unknown>;

export async function loadPlacementReview(access: ProjectAccess, placementId: string) {
  assertUuid(placementId, "Placement");
  const role = permit(access, "project.read");
  const { project } = access;
  const projectId = project.id;
  const snapshot = await placementSnapshot(db, projectId, placementId);
  const placement = snapshot.placement as Row | undefined;
  if (!placement || placement.deletedAt) throw notFound("Placement");
  const mixId = placement.mixId as string | null;
  const [mix] = mixId ? await db.select().from(mixDesigns).where(and(eq(mixDesigns.id, mixId), eq(mixDesigns.projectId, projectId))) : [];
  const [signatures, notes, conflictRows] = await Promise.all([
    db
      .select({ id: signOffs.id, role: signOffs.role, signedAt: signOffs.signedAt, typedName: signOffs.typedName, signerName: users.name, signatureImage: signOffs.signatureImage, contentHash: signOffs.contentHash })
      .from(signOffs)
      .leftJoin(users, eq(users.id, signOffs.signerId))
      .where(and(eq(signOffs.projectId, projectId), eq(signOffs.recordType, "placements"), eq(signOffs.recordId, placementId)))
      .orderBy(asc(signOffs.signedAt)),
    db
      .select({ id: amendments.id, what: amendments.what, why: amendments.why, createdAt: amendments.createdAt, authorName: users.name })
      .from(amendments)
      .leftJoin(users, eq(users.id, amendments.authorId))
      .where(and(eq(amendments.projectId, projectId), eq(amendments.recordType, "placements"), eq(amendments.recordId, placementId)))
      .orderBy(asc(amendments.createdAt)),
    db
      .select({ id: conflicts.id, recordType: conflicts.recordType, recordId: conflicts.recordId, reason: conflicts.reason, createdAt: conflicts.createdAt, resolvedAt: conflicts.resolvedAt, clientPayload: conflicts.clientPayload, serverPayload: conflicts.serverPayload })
      .from(conflicts)
      .where(and(eq(conflicts.projectId, projectId), inArray(conflicts.recordId, snapshot.recordIds)))
      .orderBy(desc(conflicts.createdAt)),
  ]);
  const date = localDate(placement.plannedStart as Date, project.timeZone);
  // The rulebook on every record of this placement, whatever day it was made (lib/checks).
  const warnings = await placementWarnings(db, project, snapshot);
  const signed = placement.state === "signed";
  return {
    role,
    canCorrect: !signed && allows(access, "record.correct"),
    project,
    date,
    placement,
    mix: mix ?? null,
    children: snapshot.children,
    photos: snapshot.photos,
    signatures,
    amendments: notes,
    conflicts: conflictRows,
    warnings,
  };
}
export type PlacementReview = Awaited<ReturnType<typeof loadPlacementReview>>;
