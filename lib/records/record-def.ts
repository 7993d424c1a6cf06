// The server's description of a record type: the shared description (lib/records/descriptions.ts:
// label, schemas, defaults, parent, mergeable fields) plus what only the server knows: its table,
// who writes it, what freezes it, how lists are ordered. lib/records/write.ts and read.ts are the
// only code that interprets these descriptions.
import type { AnyPgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Action } from "@/lib/auth/can";
import type { ComputeContext } from "./compute";
import type { ParentLink, RecordDescription } from "./descriptions";
import type { RecordType } from "./record-types";

/** The columns every synced table has (db/schema/columns.ts syncedColumns). */
export type SyncedTable = PgTable & {
  id: AnyPgColumn;
  projectId: AnyPgColumn;
  version: AnyPgColumn;
  changeSeq: AnyPgColumn;
  createdAt: AnyPgColumn;
  updatedAt: AnyPgColumn;
  updatedBy: AnyPgColumn;
  deletedAt: AnyPgColumn;
};

/** Another record this one may point at (same project). */
export type Link = {
  field: string;
  type: RecordType;
  /** The linked record must hang off the same placement as this one (a test's delivery). */
  samePlacement?: boolean;
};

export type RecordDef = RecordDescription & {
  table: SyncedTable;
  /** The permission to write it (lib/auth/can); the office may also write any unsigned record ("record.correct"). */
  action: Action;
  parent?: ParentLink;
  /** Other records it may point at (same project). */
  refs?: Link[];
  /**
   * How to find the placement whose signature freezes this record; "visit" / "siteVisitId": the
   * signed visit report that freezes it (lib/site-visits/freeze.ts).
   */
  frozenBy: "self" | "placementId" | "checklist" | "record" | "visit" | "siteVisitId" | null;
  /**
   * A link whose type is itself a field (photos: recordType + recordId): the target must exist in
   * the same project and not be deleted; deleting the target tombstones this record too.
   */
  target?: { typeField: string; idField: string };
  /** The main date: list filters (from, to) and order. */
  dateField: string;
  dateKind: "instant" | "date";
  compute?: (values: Record<string, unknown>, ctx: ComputeContext) => Record<string, unknown>;
  /** A partial unique index (other than the id) and the field and message a duplicate maps to. */
  unique?: { index: string; field: string; message: string };
  /** Why the record may not be deleted now, or null. */
  deleteBlocked?: (row: Record<string, unknown>) => string | null;
};

/** The server's part of a description; the list date defaults to the creation time. */
export type ServerPart = Omit<RecordDef, keyof RecordDescription | "dateField" | "dateKind"> &
  Partial<Pick<RecordDef, "dateField" | "dateKind">>;
