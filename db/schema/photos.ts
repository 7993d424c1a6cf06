import { bigint, index, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { syncedConstraints } from "./synced";

/**
 * Photo metadata; the bytes live in object storage (a later issue). `recordType` is the record
 * type of lib/records (e.g. "deliveries"); a photo of a signed placement's record is frozen.
 */
export const photos = pgTable(
  "photos",
  {
    ...syncedColumns(),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    recordId: uuid("record_id").notNull(),
    caption: text("caption").notNull().default(""),
    takenAt: instantColumn("taken_at"),
    sha256: varchar("sha256", { length: 64 }).notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    contentType: varchar("content_type", { length: 100 }).notNull(),
    storageKey: text("storage_key"),
    /** Set when the upload was verified (size, type, hash); null while the bytes are on the device. */
    storedAt: instantColumn("stored_at"),
  },
  (t) => [...syncedConstraints("photos", t), index("photos_record_idx").on(t.recordType, t.recordId)],
);
