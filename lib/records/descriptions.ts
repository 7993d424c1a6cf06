// Every synced record type, described once for both sides: its label, the zod schemas that check a
// create and an update, what the server fills in by default, the record it hangs off and the fields
// a sync push may merge. The server registry (lib/records/registry.ts) adds its table and rules; the
// device (lib/sync/client/record-types.ts) adds its Dexie indexes. It ships to the browser: it
// imports only the schemas, never the database or the framework.
import type { z } from "zod";
import { RECORD_TYPES, type RecordType } from "./record-types";
import * as s from "./schemas";

/** Fields by which a child record points at its parent (all indexed on the device). */
export type ParentField = "placementId" | "diaryEntryId" | "checklistId" | "specimenSetId" | "siteVisitId" | "sensorId";

export type ParentLink = {
  readonly field: ParentField;
  readonly type: RecordType;
  /**
   * The link may be empty and the record outlives its parent (a weather observation of the day):
   * checked like any link, but the record is not tombstoned with the parent.
   */
  readonly optional?: true;
};

export type RecordDescription = {
  readonly type: RecordType;
  /** For messages: "Delivery not found." */
  readonly label: string;
  readonly create: z.ZodType<Record<string, unknown>>;
  readonly update: z.ZodType<Record<string, unknown>>;
  /** What the server fills in when a create leaves a field out: every field has its zod default. */
  readonly serverDefaults: z.ZodObject;
  /** The record it belongs to (same project, never changed); deleting the parent tombstones it too. */
  readonly parent?: ParentLink;
  /**
   * Fields the sync push may apply onto a newer version than the device saw: measured values and
   * choices of a single field. Free text is never merged (SYNC.md: no last-writer-wins on text).
   */
  readonly mergeable: readonly string[];
  /**
   * Fields only the server writes that a create leaves empty without a default of their own (a hold
   * reason): they type the device's record (lib/sync/client/local-record.ts), nothing more.
   */
  readonly serverWritten?: z.ZodObject;
};

const placement = { field: "placementId", type: "placements" } as const satisfies ParentLink;
const diaryEntry = { field: "diaryEntryId", type: "diary-entries" } as const satisfies ParentLink;

export const RECORD_DESCRIPTIONS = {
  "mix-designs": {
    type: "mix-designs",
    label: "Mix design",
    create: s.mixDesignCreateSchema,
    update: s.mixDesignUpdateSchema,
    serverDefaults: s.mixDesignDefaults,
    mergeable: [],
  },
  placements: {
    type: "placements",
    label: "Placement",
    create: s.placementCreateSchema,
    update: s.placementUpdateSchema,
    serverDefaults: s.placementDefaults,
    serverWritten: s.placementServerWritten,
    mergeable: ["plannedStart", "plannedVolumeM3", "leastDimensionMm"],
  },
  deliveries: {
    type: "deliveries",
    label: "Delivery",
    create: s.deliveryCreateSchema,
    update: s.deliveryUpdateSchema,
    serverDefaults: s.deliveryDefaults,
    parent: placement,
    mergeable: ["dischargeStartedAt", "dischargeFinishedAt", "revolutions", "status"],
  },
  "field-tests": {
    type: "field-tests",
    label: "Field test",
    create: s.fieldTestCreateSchema,
    update: s.fieldTestUpdateSchema,
    serverDefaults: s.fieldTestDefaults,
    parent: placement,
    mergeable: ["slumpMm", "slumpFlowMm", "airPct", "concreteTempC", "airTempC", "densityKgM3"],
  },
  "specimen-sets": {
    type: "specimen-sets",
    label: "Specimen set",
    create: s.specimenSetCreateSchema,
    update: s.specimenSetUpdateSchema,
    serverDefaults: s.specimenSetDefaults,
    parent: placement,
    mergeable: ["initialCuringMinC", "initialCuringMaxC", "sensorId"],
  },
  breaks: {
    type: "breaks",
    label: "Break",
    create: s.breakCreateSchema,
    update: s.breakUpdateSchema,
    serverDefaults: s.breakDefaults,
    parent: { field: "specimenSetId", type: "specimen-sets" },
    mergeable: ["fractureType"],
  },
  "weather-observations": {
    type: "weather-observations",
    label: "Weather observation",
    create: s.weatherCreateSchema,
    update: s.weatherUpdateSchema,
    serverDefaults: s.weatherDefaults,
    // An observation may belong to the project's day rather than one placement.
    parent: { ...placement, optional: true },
    mergeable: ["sun"],
  },
  checklists: {
    type: "checklists",
    label: "Checklist",
    create: s.checklistCreateSchema,
    update: s.checklistUpdateSchema,
    serverDefaults: s.checklistDefaults,
    parent: placement,
    mergeable: [],
  },
  "checklist-items": {
    type: "checklist-items",
    label: "Checklist item",
    create: s.checklistItemCreateSchema,
    update: s.checklistItemUpdateSchema,
    serverDefaults: s.checklistItemDefaults,
    parent: { field: "checklistId", type: "checklists" },
    mergeable: ["answer"],
  },
  "curing-readings": {
    type: "curing-readings",
    label: "Curing reading",
    create: s.curingCreateSchema,
    update: s.curingUpdateSchema,
    serverDefaults: s.curingDefaults,
    parent: placement,
    mergeable: ["tempC"],
  },
  "diary-entries": {
    type: "diary-entries",
    label: "Diary entry",
    create: s.diaryEntryCreateSchema,
    update: s.diaryEntryUpdateSchema,
    serverDefaults: s.diaryEntryDefaults,
    mergeable: [],
  },
  "diary-crew": {
    type: "diary-crew",
    label: "Crew line",
    create: s.diaryCrewCreateSchema,
    update: s.diaryCrewUpdateSchema,
    serverDefaults: s.diaryCrewDefaults,
    parent: diaryEntry,
    mergeable: ["count"],
  },
  "diary-equipment": {
    type: "diary-equipment",
    label: "Equipment line",
    create: s.diaryEquipmentCreateSchema,
    update: s.diaryEquipmentUpdateSchema,
    serverDefaults: s.diaryEquipmentDefaults,
    parent: diaryEntry,
    mergeable: ["count", "hours"],
  },
  "diary-delays": {
    type: "diary-delays",
    label: "Delay",
    create: s.diaryDelayCreateSchema,
    update: s.diaryDelayUpdateSchema,
    serverDefaults: s.diaryDelayDefaults,
    parent: diaryEntry,
    mergeable: ["minutes"],
  },
  "diary-visitors": {
    type: "diary-visitors",
    label: "Visitor",
    create: s.diaryVisitorCreateSchema,
    update: s.diaryVisitorUpdateSchema,
    serverDefaults: s.diaryVisitorDefaults,
    parent: diaryEntry,
    mergeable: [],
  },
  "site-visits": {
    type: "site-visits",
    label: "Site visit",
    create: s.siteVisitCreateSchema,
    update: s.siteVisitUpdateSchema,
    serverDefaults: s.siteVisitDefaults,
    mergeable: ["arrivedAt", "leftAt"],
  },
  findings: {
    type: "findings",
    label: "Finding",
    create: s.findingCreateSchema,
    update: s.findingUpdateSchema,
    serverDefaults: s.findingDefaults,
    parent: { field: "siteVisitId", type: "site-visits" },
    mergeable: ["severity", "dueDate"],
  },
  photos: {
    type: "photos",
    label: "Photo",
    create: s.photoCreateSchema,
    update: s.photoUpdateSchema,
    serverDefaults: s.photoDefaults,
    // The caption is free text: never merged.
    mergeable: [],
  },
  "temperature-sensors": {
    type: "temperature-sensors",
    label: "Temperature sensor",
    create: s.sensorCreateSchema,
    update: s.sensorUpdateSchema,
    serverDefaults: s.sensorDefaults,
    parent: placement,
    mergeable: ["loggingIntervalMinutes", "endedAt"],
  },
  // Batches of readings: firstAt and lastAt come from the create schema.
  "sensor-readings": {
    type: "sensor-readings",
    label: "Sensor readings",
    create: s.sensorReadingsCreateSchema,
    update: s.sensorReadingsUpdateSchema,
    serverDefaults: s.sensorReadingsDefaults,
    parent: { field: "sensorId", type: "temperature-sensors" },
    mergeable: [],
  },
} as const satisfies { [T in RecordType]: RecordDescription & { type: T } };

export type Descriptions = typeof RECORD_DESCRIPTIONS;

/** The shared description of a record type. */
export function describeRecord<T extends RecordType>(type: T): Descriptions[T] {
  return RECORD_DESCRIPTIONS[type];
}

/** The values the server fills in when a create leaves them out, from the zod defaults. */
export function defaultValues(type: RecordType): Record<string, unknown> {
  return RECORD_DESCRIPTIONS[type].serverDefaults.parse({});
}

export { RECORD_TYPES, type RecordType };
