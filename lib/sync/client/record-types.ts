// The device's description of every synced record type: its local table, the shared zod schemas the
// write functions validate with, the parent field it hangs off, the indexes screens query by and the
// values the server fills in by default (so an optimistic row looks like the row the server will send).
//
// Only `import type` from lib/records/registry: the registry pulls in the Drizzle tables, which have
// no place in the browser bundle. The keys below are checked against RECORD_TYPES in a unit test, and
// the `Record<RecordType, …>` type makes a missing or extra type a compile error.
import type { ZodType } from "zod";
import type { RecordType } from "@/lib/records/registry";
import * as s from "@/lib/records/schemas";

export type { RecordType };

/** Fields by which a child record points at its parent (all indexed locally). */
export type ParentField = "placementId" | "diaryEntryId" | "checklistId" | "specimenSetId" | "siteVisitId" | "sensorId";

export type LocalTypeDef = {
  type: RecordType;
  /** Dexie table name: the camelCase of the type ("field-tests" → "fieldTests"). */
  table: string;
  label: string;
  create: ZodType<Record<string, unknown>>;
  update: ZodType<Record<string, unknown>>;
  parentField?: ParentField;
  /** Extra Dexie indexes beyond `id, projectId, [projectId+changeSeq], pending`. */
  indexes: readonly string[];
  /** Server-side column defaults (db/schema), applied to rows created on the device. */
  defaults: Readonly<Record<string, unknown>>;
};

const def = (d: LocalTypeDef) => d;

export const LOCAL_TYPES: Record<RecordType, LocalTypeDef> = {
  "mix-designs": def({
    type: "mix-designs",
    table: "mixDesigns",
    label: "Mix design",
    create: s.mixDesignCreateSchema,
    update: s.mixDesignUpdateSchema,
    indexes: ["[projectId+code]"],
    defaults: { supplier: "", fcAgeDays: 28, slumpType: "target", cementType: "", scms: "", siteWaterAllowedLPerM3: 0, lowBleed: false },
  }),
  placements: def({
    type: "placements",
    table: "placements",
    label: "Placement",
    create: s.placementCreateSchema,
    update: s.placementUpdateSchema,
    indexes: ["[projectId+plannedStart]", "mixId", "state"],
    defaults: { level: "", grid: "", state: "planned", leastDimensionMm: null, plannedVolumeM3: null, mixId: null },
  }),
  deliveries: def({
    type: "deliveries",
    table: "deliveries",
    label: "Delivery",
    create: s.deliveryCreateSchema,
    update: s.deliveryUpdateSchema,
    parentField: "placementId",
    indexes: ["[placementId+arrivedAt]"],
    defaults: { truck: "", status: "accepted" },
  }),
  "field-tests": def({
    type: "field-tests",
    table: "fieldTests",
    label: "Field test",
    create: s.fieldTestCreateSchema,
    update: s.fieldTestUpdateSchema,
    parentField: "placementId",
    indexes: ["deliveryId"],
    defaults: { deliveryId: null },
  }),
  "specimen-sets": def({
    type: "specimen-sets",
    table: "specimenSets",
    label: "Specimen set",
    create: s.specimenSetCreateSchema,
    update: s.specimenSetUpdateSchema,
    parentField: "placementId",
    indexes: ["deliveryId"],
    defaults: { deliveryId: null, sensorId: null },
  }),
  breaks: def({
    type: "breaks",
    table: "breaks",
    label: "Break",
    create: s.breakCreateSchema,
    update: s.breakUpdateSchema,
    parentField: "specimenSetId",
    indexes: [],
    defaults: {},
  }),
  "weather-observations": def({
    type: "weather-observations",
    table: "weatherObservations",
    label: "Weather observation",
    create: s.weatherCreateSchema,
    update: s.weatherUpdateSchema,
    // Optional link: an observation may belong to the project's day rather than one placement.
    parentField: "placementId",
    indexes: ["[projectId+observedAt]"],
    defaults: { placementId: null },
  }),
  checklists: def({
    type: "checklists",
    table: "checklists",
    label: "Checklist",
    create: s.checklistCreateSchema,
    update: s.checklistUpdateSchema,
    parentField: "placementId",
    indexes: [],
    defaults: {},
  }),
  "checklist-items": def({
    type: "checklist-items",
    table: "checklistItems",
    label: "Checklist item",
    create: s.checklistItemCreateSchema,
    update: s.checklistItemUpdateSchema,
    parentField: "checklistId",
    indexes: [],
    defaults: { answer: null, note: null },
  }),
  "curing-readings": def({
    type: "curing-readings",
    table: "curingReadings",
    label: "Curing reading",
    create: s.curingCreateSchema,
    update: s.curingUpdateSchema,
    parentField: "placementId",
    indexes: [],
    defaults: { location: "" },
  }),
  "diary-entries": def({
    type: "diary-entries",
    table: "diaryEntries",
    label: "Diary entry",
    create: s.diaryEntryCreateSchema,
    update: s.diaryEntryUpdateSchema,
    indexes: ["[projectId+date]"],
    defaults: { weatherSummary: "", workDone: "", safetyNotes: "" },
  }),
  "diary-crew": def({
    type: "diary-crew",
    table: "diaryCrew",
    label: "Crew line",
    create: s.diaryCrewCreateSchema,
    update: s.diaryCrewUpdateSchema,
    parentField: "diaryEntryId",
    indexes: [],
    defaults: {},
  }),
  "diary-equipment": def({
    type: "diary-equipment",
    table: "diaryEquipment",
    label: "Equipment line",
    create: s.diaryEquipmentCreateSchema,
    update: s.diaryEquipmentUpdateSchema,
    parentField: "diaryEntryId",
    indexes: [],
    defaults: { count: null, hours: null },
  }),
  "diary-delays": def({
    type: "diary-delays",
    table: "diaryDelays",
    label: "Delay",
    create: s.diaryDelayCreateSchema,
    update: s.diaryDelayUpdateSchema,
    parentField: "diaryEntryId",
    indexes: [],
    defaults: { description: "" },
  }),
  "diary-visitors": def({
    type: "diary-visitors",
    table: "diaryVisitors",
    label: "Visitor",
    create: s.diaryVisitorCreateSchema,
    update: s.diaryVisitorUpdateSchema,
    parentField: "diaryEntryId",
    indexes: [],
    defaults: { company: "", purpose: "" },
  }),
  "site-visits": def({
    type: "site-visits",
    table: "siteVisits",
    label: "Site visit",
    create: s.siteVisitCreateSchema,
    update: s.siteVisitUpdateSchema,
    indexes: ["[projectId+visitDate]", "state"],
    defaults: {
      arrivedAt: null,
      leftAt: null,
      areasInspected: "",
      elementsInspected: "",
      testsWitnessed: "",
      weather: "",
      notes: "",
      placementIds: [],
      state: "draft",
      submittedAt: null,
      signedAt: null,
      signedBy: null,
    },
  }),
  findings: def({
    type: "findings",
    table: "findings",
    label: "Finding",
    create: s.findingCreateSchema,
    update: s.findingUpdateSchema,
    parentField: "siteVisitId",
    // placementId: the placement a finding holds up (shown on that placement's screen).
    indexes: ["placementId", "state"],
    defaults: {
      placementId: null,
      location: "",
      requirement: "",
      actionRequired: "",
      dueDate: null,
      state: "open",
      response: null,
      answeredAt: null,
      answeredBy: null,
      closedAt: null,
      closedBy: null,
      closeNote: null,
      reopenedAt: null,
      reopenedBy: null,
      reopenReason: null,
    },
  }),
  // Photo metadata; the bytes wait in the `blobs` table and go through the photo lane (lib/photos/client).
  // storageKey and storedAt are the server's: null until a pull brings them.
  photos: def({
    type: "photos",
    table: "photos",
    label: "Photo",
    create: s.photoCreateSchema,
    update: s.photoUpdateSchema,
    indexes: ["[recordType+recordId]", "recordId"],
    defaults: { caption: "", takenAt: null, storageKey: null, storedAt: null },
  }),
  "temperature-sensors": def({
    type: "temperature-sensors",
    table: "temperatureSensors",
    label: "Temperature sensor",
    create: s.sensorCreateSchema,
    update: s.sensorUpdateSchema,
    parentField: "placementId",
    indexes: [],
    defaults: { location: "", loggingIntervalMinutes: null, endedAt: null, note: null },
  }),
  // Batches of readings (lib/records/schemas/maturity.ts): firstAt and lastAt come from the schema.
  "sensor-readings": def({
    type: "sensor-readings",
    table: "sensorReadings",
    label: "Sensor readings",
    create: s.sensorReadingsCreateSchema,
    update: s.sensorReadingsUpdateSchema,
    parentField: "sensorId",
    indexes: [],
    defaults: {},
  }),
};

/** Every synced record type, in the registry's order. */
export const LOCAL_RECORD_TYPES = Object.keys(LOCAL_TYPES) as RecordType[];

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
