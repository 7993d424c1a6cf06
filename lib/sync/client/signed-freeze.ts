// The device's signed freeze: a record of a signed placement (or of a signed visit report) cannot
// change here, as on the server (lib/records/guards.ts); the server checks again.
import { PHOTO_SIGNED_MESSAGE } from "@/lib/photos/rules";
import type { LocalRecord, SyncDb } from "./db";
import { LocalWriteError } from "./errors";
import { isLocalRecordType, type RecordType } from "./record-types";
import { assertVisitNotSigned } from "./visit-freeze";

/** The placement whose sign-off freezes this record, if any (as lib/records/registry frozenBy). */
async function freezingPlacement(db: SyncDb, type: RecordType, values: Record<string, unknown>): Promise<LocalRecord | undefined> {
  if (type === "placements") return values as LocalRecord;
  if (type === "photos") {
    // A photo is frozen with the record it shows (an amendment's photo never is).
    const target = values.recordType;
    if (typeof target !== "string" || !isLocalRecordType(target) || typeof values.recordId !== "string") return undefined;
    const row = await db.records(target).get(values.recordId);
    return row ? freezingPlacement(db, target, row) : undefined;
  }
  if (type === "checklist-items") {
    const checklist = typeof values.checklistId === "string" ? await db.records("checklists").get(values.checklistId) : undefined;
    return typeof checklist?.placementId === "string" ? db.records("placements").get(checklist.placementId) : undefined;
  }
  const frozenByPlacement: RecordType[] = ["deliveries", "field-tests", "specimen-sets", "weather-observations", "checklists", "curing-readings"];
  if (frozenByPlacement.includes(type) && typeof values.placementId === "string") {
    return db.records("placements").get(values.placementId);
  }
  return undefined;
}

export async function assertNotSigned(db: SyncDb, type: RecordType, values: Record<string, unknown>) {
  if (type === "site-visits" || type === "findings") return assertVisitNotSigned(db, type, values);
  const placement = await freezingPlacement(db, type, values);
  if (placement?.state === "signed") {
    if (type === "photos") throw new LocalWriteError("signed", PHOTO_SIGNED_MESSAGE);
    throw new LocalWriteError("signed", "This placement is signed, so its records cannot change. Ask the office for an amendment.");
  }
}

