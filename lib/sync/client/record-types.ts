// The device's description of every synced record type: the shared description
// (lib/records/descriptions.ts: label, schemas, defaults, parent) extended with its local table and
// the indexes screens query by. The defaults come from the zod defaults, so an optimistic row looks
// like the row the server will send.
//
// Nothing here imports lib/records/registry: the registry pulls in the Drizzle tables, which have
// no place in the browser bundle.
import { defaultValues, RECORD_DESCRIPTIONS, type ParentField, type RecordDescription } from "@/lib/records/descriptions";
import { RECORD_TYPES, type RecordType } from "@/lib/records/record-types";

export type { ParentField, RecordType };

export type LocalTypeDef = RecordDescription & {
  /** Dexie table name: the camelCase of the type ("field-tests" → "fieldTests"). */
  table: string;
  /** The field by which it points at its parent (indexed). */
  parentField?: ParentField;
  /** Extra Dexie indexes beyond `id, projectId, [projectId+changeSeq], pending` and the parent field. */
  indexes: readonly string[];
  /** Server-side column defaults, applied to rows created on the device. */
  defaults: Readonly<Record<string, unknown>>;
};

/** Extra indexes per type: what the field screens look records up by. */
const INDEXES: Record<RecordType, readonly string[]> = {
  "mix-designs": ["[projectId+code]"],
  placements: ["[projectId+plannedStart]", "mixId", "state"],
  deliveries: ["[placementId+arrivedAt]"],
  "field-tests": ["deliveryId"],
  "specimen-sets": ["deliveryId"],
  breaks: [],
  "weather-observations": ["[projectId+observedAt]"],
  checklists: [],
  "checklist-items": [],
  "curing-readings": [],
  "diary-entries": ["[projectId+date]"],
  "diary-crew": [],
  "diary-equipment": [],
  "diary-delays": [],
  "diary-visitors": [],
  "site-visits": ["[projectId+visitDate]", "state"],
  // placementId: the placement a finding holds up (shown on that placement's screen).
  findings: ["placementId", "state"],
  // Photo metadata; the bytes wait in the `blobs` table and go through the photo lane (lib/photos/client).
  photos: ["[recordType+recordId]", "recordId"],
  "temperature-sensors": [],
  "sensor-readings": [],
};

const camelCase = (type: string) => type.replace(/-([a-z])/g, (_, letter: string) => letter.toUpperCase());

function local(type: RecordType): LocalTypeDef {
  const shared: RecordDescription = RECORD_DESCRIPTIONS[type];
  return { ...shared, table: camelCase(type), parentField: shared.parent?.field, indexes: INDEXES[type], defaults: defaultValues(type) };
}

export const LOCAL_TYPES: Record<RecordType, LocalTypeDef> = Object.fromEntries(RECORD_TYPES.map((type) => [type, local(type)])) as Record<RecordType, LocalTypeDef>;

/** Every synced record type, in the registry's order. */
export const LOCAL_RECORD_TYPES: readonly RecordType[] = RECORD_TYPES;

export function isLocalRecordType(value: string): value is RecordType {
  return Object.prototype.hasOwnProperty.call(LOCAL_TYPES, value);
}

export function localDef(type: RecordType): LocalTypeDef {
  const found = LOCAL_TYPES[type];
  if (!found) throw new Error(`Unknown record type ${String(type)}`);
  return found;
}

/** The Dexie table that holds a record type ("field-tests" → "fieldTests"). */
export function tableNameOf(type: RecordType): string {
  return localDef(type).table;
}

/** The Dexie store definition of a record table. */
export function storeSpec(type: RecordType): string {
  const d = localDef(type);
  const parent = d.parentField ? [d.parentField] : [];
  return ["id", "projectId", "[projectId+changeSeq]", "pending", ...parent, ...d.indexes].join(", ");
}
