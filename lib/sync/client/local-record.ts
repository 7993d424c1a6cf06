// The shape of a record on the device, inferred from the shared description (lib/records/descriptions.ts):
// the fields of its create schema and of its server defaults (which include the fields only the
// server writes), as JSON (an instant is its ISO string, toWire in replay.ts), plus the sync fields.
//
// Two views of the same row:
// - LocalRecordBase: any record type, fields unknown. The generic sync code (pull, push, replay,
//   merge) works on this one and never needs to know a type's fields.
// - LocalRecord<"deliveries">: the typed row a screen reads, narrowed only at the typed accessors
//   (SyncDb.records, lib/sync/client/queries.ts).
import type { z } from "zod";
import type { Descriptions } from "@/lib/records/descriptions";
import type { RecordType } from "@/lib/records/record-types";
import type { SyncedRecord } from "@/lib/sync/protocol";

/** A record as stored on the device. `version` is the version the server last acknowledged (0: never). */
export type LocalRecordBase = SyncedRecord & {
  pending: 0 | 1;
  serverCopy: SyncedRecord | null;
  /** Set by the server (db/schema/columns.ts); missing on a row made here and not yet pulled back. */
  createdAt?: string;
  updatedAt?: string;
  updatedBy?: string | null;
};

/** A value as the device stores it: JSON, so a Date is its ISO string (null and the rest unchanged). */
type Stored<V> = V extends Date ? string : V;
type StoredObject<O> = { [K in keyof O]: Stored<O[K]> };

/** The create schema's fields: optional where a create may leave them out (older rows may lack them too). */
type CreateFields<T extends RecordType> = StoredObject<z.output<Descriptions[T]["create"]>>;
/** Fields the server always fills in (a default or its own, null until it writes them). */
type DefaultFields<T extends RecordType> = StoredObject<z.output<Descriptions[T]["serverDefaults"]>>;

/** Fields only the server writes, where the description names them apart from its defaults. */
type WrittenFields<T extends RecordType> = Descriptions[T] extends { serverWritten: infer S extends z.ZodType } ? StoredObject<z.output<S>> : unknown;

/** The sync fields every row has (SyncedRecord's named fields and the device's two). */
type SyncFields = "id" | "projectId" | "version" | "changeSeq" | "deletedAt" | "pending" | "serverCopy" | "createdAt" | "updatedAt" | "updatedBy";

/** The fields of a record type as the device stores them (the sync fields left to LocalRecordBase). */
export type LocalFields<T extends RecordType> = Omit<CreateFields<T> & DefaultFields<T> & WrittenFields<T>, SyncFields>;

/**
 * A record on the device. With a record type its fields have the schema's types
 * (`LocalRecord<"deliveries">["volumeM3"]` is a number); without one it is the loose base row.
 */
export type LocalRecord<T extends RecordType = RecordType> = [RecordType] extends [T] ? LocalRecordBase : LocalRecordBase & LocalFields<T>;
