// The inspector's sign-off of a visit report, like the placement's (lib/signoff/sign-off.ts):
// re-entered password, typed name, drawn signature and the SHA-256 of the canonical JSON of the
// report and its findings, stored with the state change in one transaction. From then on the
// database trigger (drizzle "site-visits-frozen") refuses changes to the report and to its findings'
// observations.
//
// Findings after the sign-off: a report may be signed with findings still open or answered (the
// inspector closes a finding after re-inspection, often on a later visit). The signature covers
// what was observed and required (the hash leaves the follow-up columns out); the sign-off answer
// and its audit entry list the findings still outstanding at that moment, and answering, closing
// and reopening go on through the lifecycle with their own audit trail.
import { and, asc, desc, eq, inArray, isNull } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { conflicts, findings, photos, signOffs, siteVisits } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, notFound } from "@/lib/errors";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { checkSigner, recordSignature } from "@/lib/signatures/record";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { signedVisitConflict } from "@/lib/records/db-errors";
import { assertUuid, lockRecord } from "@/lib/records/guards";
import { getRecordDef } from "@/lib/records/registry";
import { inTransaction } from "@/lib/records/write";
import { canonicalJson, sha256Hex } from "@/lib/signoff/canonical";
import { signOffSchema } from "@/lib/signoff/schemas";
import { isOutstanding } from "./lifecycle";

/** Workflow and bookkeeping fields: not part of what is signed. */
const BOOKKEEPING = new Set(["version", "changeSeq", "updatedAt", "updatedBy", "createdAt", "state", "submittedAt", "signedAt", "signedBy"]);
/** A finding's follow-up, which goes on after the sign-off (the trigger lets exactly these change). */
export const FINDING_FOLLOW_UP = ["state", "response", "answeredAt", "answeredBy", "closedAt", "closedBy", "closeNote", "reopenedAt", "reopenedBy", "reopenReason"];
const FOLLOW_UP = new Set(FINDING_FOLLOW_UP);

const content = (row: Record<string, unknown>, drop: Set<string>) => Object.fromEntries(Object.entries(row).filter(([key]) => !BOOKKEEPING.has(key) && !drop.has(key)));

export type VisitSnapshot = {
  visit: Record<string, unknown> | undefined;
  findings: Record<string, unknown>[];
  photos: Record<string, unknown>[];
  recordIds: string[];
};

export async function visitSnapshot(tx: Executor, projectId: string, visitId: string): Promise<VisitSnapshot> {
  const [visit] = (await tx.select().from(siteVisits).where(and(eq(siteVisits.projectId, projectId), eq(siteVisits.id, visitId)))) as Record<string, unknown>[];
  const rows = (await tx
    .select()
    .from(findings)
    .where(and(eq(findings.projectId, projectId), eq(findings.siteVisitId, visitId), isNull(findings.deletedAt)))
    .orderBy(asc(findings.id))) as Record<string, unknown>[];
  const recordIds = [visitId, ...rows.map((r) => r.id as string)];
  const photoRows = (await tx
    .select()
    .from(photos)
    .where(and(eq(photos.projectId, projectId), inArray(photos.recordId, recordIds), isNull(photos.deletedAt)))
    .orderBy(asc(photos.id))) as Record<string, unknown>[];
  return { visit, findings: rows, photos: photoRows, recordIds };
}

/** SHA-256 of the canonical JSON of the report and its findings' observations (content only). */
export function visitSnapshotHash(snapshot: VisitSnapshot): string {
  const body = {
    visit: content(snapshot.visit ?? {}, new Set()),
    findings: snapshot.findings.map((f) => content(f, FOLLOW_UP)),
    photos: snapshot.photos.map((p) => ({ id: p.id, recordId: p.recordId, sha256: p.sha256, caption: p.caption })),
  };
  return sha256Hex(canonicalJson(body));
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export async function signOffVisit(access: ProjectAccess, visitId: string, input: unknown) {
  const { user, project: { id: projectId } } = access;
  assertUuid(visitId, "Site visit");
  const body = parseOrThrow(signOffSchema, input);
  const role = await checkSigner(access, "visit.sign", body.password, { recordType: "site-visits", recordId: visitId });
  const def = getRecordDef("site-visits");
  return inTransaction({ user, access }, def, async (tx) => {
    const visit = await lockRecord(tx, def, projectId, visitId);
    if (visit.deletedAt) throw conflict("This visit report was deleted.", { reason: "deleted" });
    if (visit.state === "signed") throw signedVisitConflict();
    if (visit.state !== "submitted") {
      throw conflict("Submit the visit report before signing it (a draft can still change).", { reason: "state" });
    }
    if (visit.version !== body.baseVersion) {
      throw conflict(`The visit report changed since you reviewed it (it is now version ${visit.version}). Review it again before signing.`, {
        reason: "stale",
        currentVersion: visit.version,
      });
    }
    const snapshot = await visitSnapshot(tx, projectId, visitId);
    const open = await tx
      .select({ id: conflicts.id, recordType: conflicts.recordType })
      .from(conflicts)
      .where(and(eq(conflicts.projectId, projectId), inArray(conflicts.recordId, snapshot.recordIds), isNull(conflicts.resolvedAt)));
    const pendingPhotos = snapshot.photos.filter((p) => p.storedAt == null);
    const reasons: string[] = [];
    if (open.length) reasons.push(`${plural(open.length, "conflict", "conflicts")} to resolve (${[...new Set(open.map((c) => c.recordType))].join(", ")})`);
    if (pendingPhotos.length) reasons.push(`${plural(pendingPhotos.length, "photo", "photos")} still uploading`);
    if (reasons.length) {
      throw conflict(`This visit report cannot be signed yet: ${reasons.join(" and ")}.`, {
        reason: "open-items",
        conflicts: open.map((c) => c.id),
        pendingPhotos: pendingPhotos.map((p) => p.id),
      });
    }
    const contentHash = visitSnapshotHash(snapshot);
    const outstandingFindings = snapshot.findings.filter((f) => isOutstanding(f.state)).map((f) => ({ id: f.id as string, state: f.state as string }));
    const signedAt = new Date();
    const [signedVisit] = await tx
      .update(siteVisits)
      .set({ state: "signed", signedAt, signedBy: user.id, version: visit.version + 1, changeSeq: await nextChangeSeq(tx, projectId), updatedAt: signedAt, updatedBy: user.id })
      .where(and(eq(siteVisits.id, visitId), eq(siteVisits.projectId, projectId)))
      .returning();
    await writeAudit(tx, { projectId, userId: user.id, recordType: "site-visits", recordId: visitId, action: "transition", before: visit, after: signedVisit, note: "submitted → signed" });
    const signOff = await recordSignature(tx, {
      access, role, recordType: "site-visits", recordId: visitId, body, contentHash, signedAt,
      audit: {
        subject: { siteVisitId: visitId },
        extra: { outstandingFindings },
        note: outstandingFindings.length ? `signed with ${plural(outstandingFindings.length, "finding", "findings")} still outstanding` : undefined,
      },
    });
    return { signOff, visitVersion: signedVisit.version, outstandingFindings };
  });
}

/** The latest sign-off of a visit report and whether the report still matches what was signed. */
export async function verifyVisitSignOff(access: ProjectAccess, visitId: string) {
  const projectId = access.project.id;
  assertUuid(visitId, "Site visit");
  permit(access, "project.read");
  const snapshot = await visitSnapshot(db, projectId, visitId);
  if (!snapshot.visit) throw notFound("Site visit");
  const [signOff] = await db
    .select()
    .from(signOffs)
    .where(and(eq(signOffs.projectId, projectId), eq(signOffs.recordType, "site-visits"), eq(signOffs.recordId, visitId)))
    .orderBy(desc(signOffs.signedAt))
    .limit(1);
  const outstandingFindings = snapshot.findings.filter((f) => isOutstanding(f.state)).map((f) => ({ id: f.id as string, state: f.state as string }));
  if (!signOff) return { signed: false as const, outstandingFindings };
  const currentHash = visitSnapshotHash(snapshot);
  return { signed: true as const, signOff, currentHash, matches: currentHash === signOff.contentHash, outstandingFindings };
}
