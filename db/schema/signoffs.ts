import { foreignKey, index, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { projectRole, users } from "./auth";
import { instantColumn, syncedColumns } from "./columns";
import { syncedConstraints } from "./synced";

/** Who signed which record, as what, and the hash of the content they saw. Never updated. */
export const signOffs = pgTable(
  "sign_offs",
  {
    ...syncedColumns(),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    recordId: uuid("record_id").notNull(),
    signerId: uuid("signer_id").notNull(),
    role: projectRole("role").notNull(),
    signedAt: instantColumn("signed_at").notNull(),
    typedName: varchar("typed_name", { length: 120 }).notNull(),
    /** The drawn signature as a data URL (image/png). */
    signatureImage: text("signature_image"),
    contentHash: varchar("content_hash", { length: 64 }).notNull(),
  },
  (t) => [
    ...syncedConstraints("sign_offs", t),
    index("sign_offs_record_idx").on(t.recordType, t.recordId),
    foreignKey({ name: "sign_offs_signer_fk", columns: [t.signerId], foreignColumns: [users.id] }),
  ],
);

/** A later change to a signed record: what and why, shown beside the frozen record. */
export const amendments = pgTable(
  "amendments",
  {
    ...syncedColumns(),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    recordId: uuid("record_id").notNull(),
    what: text("what").notNull(),
    why: text("why").notNull(),
    authorId: uuid("author_id").notNull(),
  },
  (t) => [
    ...syncedConstraints("amendments", t),
    index("amendments_record_idx").on(t.recordType, t.recordId),
    foreignKey({ name: "amendments_author_fk", columns: [t.authorId], foreignColumns: [users.id] }),
  ],
);
