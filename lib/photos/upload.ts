// The photo lane (SYNC.md "Photos"): metadata first, bytes by presigned PUT, then "complete", where
// the server checks that the stored object has the declared size, type, magic bytes and SHA-256, and
// copies the bytes it checked to a key no device can write (storedPhotoKey), so a presigned PUT that
// is still valid cannot change a photo after it is stored or signed.
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { photos } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { writeAudit } from "@/lib/audit";
import { conflict, invalidInput, notFound } from "@/lib/errors";
import { permit, type ProjectAccess } from "@/lib/auth/access";
import { nextChangeSeq } from "@/lib/records/change-seq";
import { assertUuid } from "@/lib/records/guards";
import { getRecordDef } from "@/lib/records/registry";
import { createRecord, inTransaction } from "@/lib/records/write";
import { photoFields } from "@/lib/records/schemas/photo";
import { logger } from "@/lib/log";
import { sniffPhotoType } from "./image-header";
import { ATTACHABLE, photoKey, photoProblem, photoProblemField, storedPhotoKey, type PhotoType } from "./rules";
import { deleteObject, headObject, presignGet, presignPut, readObject, writeObject } from "./storage";

export { ATTACHABLE };

/** The body of a registration (POST …/photos/<id>): the metadata the device also syncs (lib/records/schemas/photo.ts). */
export const photoUploadSchema = z.object({
  recordType: photoFields.recordType,
  recordId: z.uuid("Choose the record the photo belongs to."),
  caption: z.string().trim().max(500, "Keep the caption under 500 characters.").default(""),
  takenAt: z.iso.datetime({ offset: true, error: "The time the photo was taken is not a valid date." }).nullable().optional(),
  contentType: photoFields.contentType,
  sizeBytes: photoFields.sizeBytes,
  sha256: photoFields.sha256,
});
export type PhotoUploadInput = z.input<typeof photoUploadSchema>;

type PhotoRow = typeof photos.$inferSelect;

async function findPhoto(projectId: string, photoId: string): Promise<PhotoRow | undefined> {
  const [row] = await db.select().from(photos).where(and(eq(photos.projectId, projectId), eq(photos.id, photoId)));
  return row;
}

/** Registers the photo (idempotent by id + hash) and returns where to PUT its bytes. */
export async function requestPhotoUpload(access: ProjectAccess, photoId: string, input: unknown) {
  const { user, project: { id: projectId } } = access;
  assertUuid(photoId, "Photo");
  const body = parseOrThrow(photoUploadSchema, input);
  const problem = photoProblem(body.contentType, body.sizeBytes);
  if (problem) throw invalidInput(problem, { [photoProblemField(body.contentType)]: problem });
  const contentType = body.contentType as PhotoType;

  // Usually the photo arrived through sync already (its metadata mutation); otherwise this creates
  // it through the one write path of records, with the same checks (role, record, signed freeze).
  permit(access, "photo.add");
  const row = await inTransaction({ user, access }, getRecordDef("photos"), async (tx) => {
    const [existing] = await tx.select().from(photos).where(eq(photos.id, photoId)).for("update");
    if (existing) {
      if (existing.projectId !== projectId || existing.sha256 !== body.sha256) {
        throw conflict("A different photo was already registered with this id.", { reason: "hash" });
      }
      if (existing.deletedAt) throw conflict("This photo was deleted.", { reason: "deleted" });
      return existing;
    }
    const { record } = await createRecord({ user, access, tx }, "photos", projectId, { ...body, id: photoId });
    return record as PhotoRow;
  });
  if (row.storedAt) return { stored: true as const, photoId };
  const key = row.storageKey ?? photoKey(projectId, photoId, contentType);
  return { stored: false as const, photoId, key, uploadUrl: await presignPut(key, contentType, body.sizeBytes), headers: { "content-type": contentType } };
}

/** Verifies the uploaded object (exists, size, type, SHA-256) and marks the photo stored. */
export async function completePhotoUpload(access: ProjectAccess, photoId: string) {
  const { user, project: { id: projectId } } = access;
  assertUuid(photoId, "Photo");
  permit(access, "photo.add");
  const photo = await findPhoto(projectId, photoId);
  if (!photo || photo.deletedAt) throw notFound("Photo");
  if (photo.storedAt) return { stored: true, photoId };
  const key = photo.storageKey ?? photoKey(projectId, photoId, photo.contentType as PhotoType);
  const head = await headObject(key);
  if (!head) throw conflict("The photo's bytes have not arrived yet. Upload them, then try again.", { reason: "missing" });
  if (head.size !== photo.sizeBytes) throw conflict(`The stored file is ${head.size} bytes, not the ${photo.sizeBytes} declared.`, { reason: "size" });
  if (head.contentType !== photo.contentType) throw conflict(`The stored file is ${head.contentType}, not ${photo.contentType}.`, { reason: "type" });
  const bytes = await readObject(key);
  const digest = createHash("sha256").update(bytes).digest("hex");
  if (digest !== photo.sha256) throw conflict("The stored file does not match the photo's fingerprint (SHA-256). Upload it again.", { reason: "hash" });
  if (sniffPhotoType(bytes) !== photo.contentType) {
    throw conflict(`The uploaded file is not a ${photo.contentType.replace("image/", "").toUpperCase()} image: its first bytes say otherwise. Take or choose the photo again.`, { reason: "type" });
  }
  // The checked bytes themselves (not a server-side copy of the upload key, which could be rewritten
  // between the check and the copy) go to the key only the server writes.
  const storedKey = storedPhotoKey(projectId, photoId, photo.sha256, photo.contentType as PhotoType);
  await writeObject(storedKey, bytes, photo.contentType);
  const stored = await inTransaction({ user, access }, getRecordDef("photos"), async (tx) => {
    const changeSeq = await nextChangeSeq(tx, projectId);
    const [after] = await tx
      .update(photos)
      .set({ storedAt: new Date(), storageKey: storedKey, version: photo.version + 1, changeSeq, updatedAt: new Date(), updatedBy: user.id })
      .where(and(eq(photos.id, photoId), eq(photos.version, photo.version)))
      .returning();
    if (after) await writeAudit(tx, { projectId, userId: user.id, recordType: "photo", recordId: photoId, action: "stored", before: photo, after });
    return Boolean(after);
  });
  // After commit: the upload copy is no longer read by anything.
  if (stored && key !== storedKey) await deleteObject(key).catch((error) => logger.warn({ err: error, photoId }, "upload copy of a stored photo not deleted"));
  return { stored: true, photoId };
}

/** A short-lived link to view a stored photo (members only). */
export async function photoViewUrl(access: ProjectAccess, photoId: string) {
  const projectId = access.project.id;
  assertUuid(photoId, "Photo");
  permit(access, "project.read");
  const photo = await findPhoto(projectId, photoId);
  if (!photo || photo.deletedAt) throw notFound("Photo");
  if (!photo.storedAt) return { stored: false as const };
  return { stored: true as const, url: await presignGet(photo.storageKey!) };
}
