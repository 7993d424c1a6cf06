// An amendment beside a signed placement can itself be signed (issue 7): the same password, typed
// name and drawn signature as the placement's sign-off, and a SHA-256 of the amendment's canonical
// JSON, stored as a sign_offs row for record type "amendments". Amendments are never updated, so
// the hash says whether the stored text is still what was signed.
import { and, asc, eq, getTableColumns, inArray } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { amendments, signOffs, users } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { conflict, notFound } from "@/lib/errors";
import type { ProjectAccess } from "@/lib/auth/access";
import { assertUuid } from "@/lib/records/guards";
import { inTransaction } from "@/lib/records/write";
import { canonicalJson, sha256Hex } from "./canonical";
import { checkSigner, recordSignature } from "@/lib/signatures/record";
import { signOffSchema } from "./schemas";

type AmendmentRow = typeof amendments.$inferSelect;

/** The content of an amendment that its signature covers (no bookkeeping fields). */
export function amendmentHash(a: Pick<AmendmentRow, "id" | "recordType" | "recordId" | "what" | "why" | "authorId" | "createdAt">): string {
  return sha256Hex(canonicalJson({ id: a.id, recordType: a.recordType, recordId: a.recordId, what: a.what, why: a.why, authorId: a.authorId, createdAt: a.createdAt }));
}

/** The amendments of a placement, oldest first, each with its author's name and its signature if signed. */
export async function amendmentsWithSignOffs(projectId: string, placementId: string, tx: Executor = db) {
  const list = await tx
    .select({ ...getTableColumns(amendments), authorName: users.name })
    .from(amendments)
    .leftJoin(users, eq(users.id, amendments.authorId))
    .where(and(eq(amendments.projectId, projectId), eq(amendments.recordType, "placements"), eq(amendments.recordId, placementId)))
    .orderBy(asc(amendments.createdAt), asc(amendments.id));
  const ids = list.map((a) => a.id);
  const signs = ids.length
    ? await tx
        .select({ ...getTableColumns(signOffs), signerName: users.name })
        .from(signOffs)
        .leftJoin(users, eq(users.id, signOffs.signerId))
        .where(and(eq(signOffs.projectId, projectId), eq(signOffs.recordType, "amendments"), inArray(signOffs.recordId, ids)))
    : [];
  return list.map((a) => {
    const signOff = signs.find((s) => s.recordId === a.id) ?? null;
    return { ...a, signOff, matches: signOff ? signOff.contentHash === amendmentHash(a) : null };
  });
}

/** Signs an amendment of a placement (inspector or office, "amendment.write"), once. */
export async function signAmendment(access: ProjectAccess, placementId: string, amendmentId: string, input: unknown) {
  const { user, project: { id: projectId } } = access;
  assertUuid(placementId, "Placement");
  assertUuid(amendmentId, "Amendment");
  const body = parseOrThrow(signOffSchema, input);
  const role = await checkSigner(access, "amendment.write", body.password, { recordType: "amendment", recordId: amendmentId });
  return inTransaction({ user, access }, undefined, async (tx) => {
    const [amendment] = await tx
      .select()
      .from(amendments)
      .where(and(eq(amendments.projectId, projectId), eq(amendments.recordId, placementId), eq(amendments.id, amendmentId)))
      .for("update");
    if (!amendment) throw notFound("Amendment");
    if (amendment.version !== body.baseVersion) {
      throw conflict(`The amendment changed since you read it (it is now version ${amendment.version}). Read it again before signing.`, {
        reason: "stale",
        currentVersion: amendment.version,
      });
    }
    const [already] = await tx
      .select({ id: signOffs.id })
      .from(signOffs)
      .where(and(eq(signOffs.projectId, projectId), eq(signOffs.recordType, "amendments"), eq(signOffs.recordId, amendmentId)));
    if (already) throw conflict("This amendment is already signed.", { reason: "signed" });
    const contentHash = amendmentHash(amendment);
    const signedAt = new Date();
    const signOff = await recordSignature(tx, {
      access, role, recordType: "amendments", recordId: amendmentId, body, contentHash, signedAt,
      audit: { subject: { amendmentId, placementId }, note: `signs amendment ${amendmentId}` },
    });
    return { signOff };
  });
}
