import { z } from "zod";
import { PHOTO_TARGETS, photoProblem, photoProblemField } from "@/lib/photos/rules";
import { clientId, instant, optionalText, recordId, serverOwned } from "./fields";

// A photo's metadata, synced like any record; the bytes go through the photo lane (lib/photos).
// storageKey and storedAt are the server's: not in these schemas, so a device can never set them.
export const photoFields = {
  recordType: z.enum(PHOTO_TARGETS, {
    error: "Photos attach to a placement, delivery, test, observation, checklist item, curing reading, diary, site visit, finding or amendment.",
  }),
  recordId: recordId("Record"),
  caption: optionalText("Caption", 500),
  takenAt: instant("Time taken").nullable(),
  sha256: z.string({ error: "Send the photo's SHA-256 as 64 hex digits." }).regex(/^[0-9a-f]{64}$/, "Send the photo's SHA-256 as 64 hex digits."),
  sizeBytes: z.number({ error: "Send the photo's size in bytes." }).int("The size is a whole number of bytes."),
  contentType: z.string({ error: "Say what kind of image this is." }),
};

function checkFile(v: { contentType?: unknown; sizeBytes?: unknown }, ctx: z.RefinementCtx) {
  if (typeof v.contentType !== "string" || typeof v.sizeBytes !== "number") return;
  const problem = photoProblem(v.contentType, v.sizeBytes);
  if (problem) ctx.addIssue({ code: "custom", path: [photoProblemField(v.contentType)], message: problem });
}

export const photoCreateSchema = z
  .object({ id: clientId, ...photoFields })
  .partial({ caption: true, takenAt: true })
  .superRefine(checkFile);

/** Only the caption changes after capture; the bytes, their hash and the record they belong to do not. */
export const photoUpdateSchema = z.object({ caption: photoFields.caption }).partial();

/** What the server fills in when a create leaves a field out; storageKey and storedAt stay null until a pull. */
export const photoDefaults = z.object({
  caption: photoFields.caption.default(""),
  takenAt: photoFields.takenAt.default(null),
  storageKey: serverOwned.text(),
  storedAt: serverOwned.instant(),
});
