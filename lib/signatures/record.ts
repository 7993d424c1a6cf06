// The one way a signature is recorded, for a placement, an amendment and a visit report alike:
// before the signing transaction, the role (can(), on the access resolved at the door) and then the
// re-entered password; inside it, the sign_offs row and its audit entry, together.
import { randomUUID } from "node:crypto";
import type { Transaction } from "@/db";
import { signOffs } from "@/db/schema";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import type { Action } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/lib/audit";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { checkSignerPassword } from "@/lib/signoff/password";

export type SignatureInput = { typedName: string; signatureImage: string; password: string };

/**
 * Role first (a superintendent is told so before being asked about passwords), then the password
 * (a wrong one is audited and refused before anything is signed). Returns the signer's role.
 */
export async function checkSigner(
  access: ProjectAccess,
  action: Action,
  password: string,
  what: { recordType: string; recordId: string },
): Promise<ProjectRole> {
  const role = permit(access, action);
  await checkSignerPassword(access.user, password, { projectId: access.project.id, ...what });
  return role;
}

export type SignatureRecord = {
  access: ProjectAccess;
  role: ProjectRole;
  /** The signed record: its type in sign_offs ("placements", "amendments", "site-visits") and id. */
  recordType: string;
  recordId: string;
  body: Pick<SignatureInput, "typedName" | "signatureImage">;
  contentHash: string;
  signedAt: Date;
  /** What the audit entry says beside the typed name, hash and time (the signed record's ids, what was acknowledged). */
  audit: { subject: Record<string, unknown>; extra?: Record<string, unknown>; note?: string };
};

/** Inside the signing transaction: the sign_offs row and its audit entry. Returns the row without the image. */
export async function recordSignature(tx: Transaction, s: SignatureRecord) {
  const { user, project } = s.access;
  const [row] = await tx
    .insert(signOffs)
    .values({
      id: randomUUID(),
      projectId: project.id,
      version: 1,
      changeSeq: await nextChangeSeq(tx, project.id),
      updatedBy: user.id,
      recordType: s.recordType,
      recordId: s.recordId,
      signerId: user.id,
      role: s.role,
      signedAt: s.signedAt,
      typedName: s.body.typedName,
      signatureImage: s.body.signatureImage,
      contentHash: s.contentHash,
    })
    .returning();
  await writeAudit(tx, {
    projectId: project.id,
    userId: user.id,
    recordType: "sign-off",
    recordId: row.id,
    action: "sign",
    after: { ...s.audit.subject, typedName: s.body.typedName, contentHash: s.contentHash, signedAt: s.signedAt, ...s.audit.extra },
    note: s.audit.note,
  });
  return { ...row, signatureImage: undefined };
}
