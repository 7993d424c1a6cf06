// Every record type the field and the office write, described once: its table, schemas, who
// writes it, how it hangs off a placement (for the signed freeze) and which fields sync may merge.
// lib/records/write.ts and read.ts are the only code that interprets these descriptions.
import type { ZodType } from "zod";
import type { AnyPgColumn, PgTable } from "drizzle-orm/pg-core";
import * as t from "@/db/schema";
import type { Action } from "@/lib/auth/can";
import { notFound } from "@/lib/errors";
import { computeBreak, computePhoto, computeWeather, type ComputeContext } from "./compute";
import * as s from "./schemas";

export { RECORD_TYPES, type RecordType } from "./record-types";
import { RECORD_TYPES, type RecordType } from "./record-types";

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

type Link = {
  field: string;
  type: RecordType;
  /** The linked record must hang off the same placement as this one (a test's delivery). */
  samePlacement?: boolean;
};

export type RecordDef = {
  type: RecordType;
  /** For messages: "Delivery not found." */
  label: string;
  table: SyncedTable;
  create: ZodType<Record<string, unknown>>;
  update: ZodType<Record<string, unknown>>;
  /** The permission to write it (lib/auth/can); the office may also write any unsigned record ("record.correct"). */
  action: Action;
  /** The record it belongs to (same project, required, never changed); deleting the parent tombstones it too. */
  parent?: Link;
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
  /**
   * Fields the sync push may apply onto a newer version than the device saw: measured values and
   * choices of a single field. Free text is never merged (SYNC.md: no last-writer-wins on text).
   */
  mergeable: readonly string[];
  /** A partial unique index (other than the id) and the field and message a duplicate maps to. */
  unique?: { index: string; field: string; message: string };
  /** Why the record may not be deleted now, or null. */
  deleteBlocked?: (row: Record<string, unknown>) => string | null;
};

const placementLink: Link = { field: "placementId", type: "placements" };
const deliveryRef: Link = { field: "deliveryId", type: "deliveries", samePlacement: true };
const diaryParent: Link = { field: "diaryEntryId", type: "diary-entries" };

const DEFS: Record<RecordType, RecordDef> = {
  "mix-designs": {
    type: "mix-designs",
    label: "Mix design",
    table: t.mixDesigns,
    create: s.mixDesignCreateSchema,
    update: s.mixDesignUpdateSchema,
    action: "mix.write",
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: [],
    unique: {
      index: "mix_designs_project_code_idx",
      field: "code",
      message: "This project already has a mix with this code",
    },
  },
  placements: {
    type: "placements",
    label: "Placement",
    table: t.placements,
    create: s.placementCreateSchema,
    update: s.placementUpdateSchema,
    action: "placement.write",
    refs: [{ field: "mixId", type: "mix-designs" }],
    frozenBy: "self",
    dateField: "plannedStart",
    dateKind: "instant",
    mergeable: ["plannedStart", "plannedVolumeM3", "leastDimensionMm"],
    deleteBlocked: (row) =>
      ["placing", "placed", "signed"].includes(row.state as string)
        ? "Concrete has been placed here, so the placement cannot be deleted; correct it instead."
        : null,
  },
  deliveries: {
    type: "deliveries",
    label: "Delivery",
    table: t.deliveries,
    create: s.deliveryCreateSchema,
    update: s.deliveryUpdateSchema,
    action: "delivery.write",
    parent: placementLink,
    frozenBy: "placementId",
    dateField: "arrivedAt",
    dateKind: "instant",
    mergeable: ["dischargeStartedAt", "dischargeFinishedAt", "revolutions", "status"],
  },
  "field-tests": {
    type: "field-tests",
    label: "Field test",
    table: t.fieldTests,
    create: s.fieldTestCreateSchema,
    update: s.fieldTestUpdateSchema,
    action: "fieldTest.write",
    parent: placementLink,
    refs: [deliveryRef],
    frozenBy: "placementId",
    dateField: "sampledAt",
    dateKind: "instant",
    mergeable: ["slumpMm", "slumpFlowMm", "airPct", "concreteTempC", "airTempC", "densityKgM3"],
  },
  "specimen-sets": {
    type: "specimen-sets",
    label: "Specimen set",
    table: t.specimenSets,
    create: s.specimenSetCreateSchema,
    update: s.specimenSetUpdateSchema,
    action: "specimen.write",
    parent: placementLink,
    // The logger cured with the set must be a sensor of the set's placement (same project).
    refs: [deliveryRef, { field: "sensorId", type: "temperature-sensors", samePlacement: true }],
    frozenBy: "placementId",
    dateField: "castAt",
    dateKind: "instant",
    mergeable: ["initialCuringMinC", "initialCuringMaxC", "sensorId"],
  },
  breaks: {
    type: "breaks",
    label: "Break",
    table: t.breaks,
    create: s.breakCreateSchema,
    update: s.breakUpdateSchema,
    action: "break.write",
    parent: { field: "specimenSetId", type: "specimen-sets" },
    // Breaks come weeks after the sign-off of the placement; they are the lab's, not frozen by it.
    frozenBy: null,
    dateField: "testedAt",
    dateKind: "instant",
    compute: computeBreak,
    mergeable: ["fractureType"],
  },
  "weather-observations": {
    type: "weather-observations",
    label: "Weather observation",
    table: t.weatherObservations,
    create: s.weatherCreateSchema,
    update: s.weatherUpdateSchema,
    action: "weather.write",
    refs: [placementLink],
    frozenBy: "placementId",
    dateField: "observedAt",
    dateKind: "instant",
    compute: computeWeather,
    mergeable: ["sun"],
  },
  checklists: {
    type: "checklists",
    label: "Checklist",
    table: t.checklists,
    create: s.checklistCreateSchema,
    update: s.checklistUpdateSchema,
    action: "checklist.write",
    parent: placementLink,
    frozenBy: "placementId",
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: [],
  },
  "checklist-items": {
    type: "checklist-items",
    label: "Checklist item",
    table: t.checklistItems,
    create: s.checklistItemCreateSchema,
    update: s.checklistItemUpdateSchema,
    action: "checklist.write",
    parent: { field: "checklistId", type: "checklists" },
    frozenBy: "checklist",
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["answer"],
  },
  "curing-readings": {
    type: "curing-readings",
    label: "Curing reading",
    table: t.curingReadings,
    create: s.curingCreateSchema,
    update: s.curingUpdateSchema,
    action: "curing.write",
    parent: placementLink,
    frozenBy: "placementId",
    dateField: "readAt",
    dateKind: "instant",
    mergeable: ["tempC"],
  },
  // Temperature records for the maturity method: not frozen by the placement's signature, since the
  // record runs for days after the pour is signed; written by those who keep the curing log.
  "temperature-sensors": {
    type: "temperature-sensors",
    label: "Temperature sensor",
    table: t.temperatureSensors,
    create: s.sensorCreateSchema,
    update: s.sensorUpdateSchema,
    action: "curing.write",
    parent: placementLink,
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["loggingIntervalMinutes", "endedAt"],
  },
  "sensor-readings": {
    type: "sensor-readings",
    label: "Sensor readings",
    table: t.sensorReadings,
    create: s.sensorReadingsCreateSchema,
    update: s.sensorReadingsUpdateSchema,
    action: "curing.write",
    parent: { field: "sensorId", type: "temperature-sensors" },
    frozenBy: null,
    dateField: "firstAt",
    dateKind: "instant",
    mergeable: [],
  },
  "diary-entries": {
    type: "diary-entries",
    label: "Diary entry",
    table: t.diaryEntries,
    create: s.diaryEntryCreateSchema,
    update: s.diaryEntryUpdateSchema,
    action: "diary.write",
    frozenBy: null,
    dateField: "date",
    dateKind: "date",
    mergeable: [],
    unique: {
      index: "diary_entries_project_date_idx",
      field: "date",
      message: "There is already a diary for this date; add to that one",
    },
  },
  "diary-crew": {
    type: "diary-crew",
    label: "Crew line",
    table: t.diaryCrew,
    create: s.diaryCrewCreateSchema,
    update: s.diaryCrewUpdateSchema,
    action: "diary.write",
    parent: diaryParent,
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["count"],
  },
  "diary-equipment": {
    type: "diary-equipment",
    label: "Equipment line",
    table: t.diaryEquipment,
    create: s.diaryEquipmentCreateSchema,
    update: s.diaryEquipmentUpdateSchema,
    action: "diary.write",
    parent: diaryParent,
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["count", "hours"],
  },
  "diary-delays": {
    type: "diary-delays",
    label: "Delay",
    table: t.diaryDelays,
    create: s.diaryDelayCreateSchema,
    update: s.diaryDelayUpdateSchema,
    action: "diary.write",
    parent: diaryParent,
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["minutes"],
  },
  "diary-visitors": {
    type: "diary-visitors",
    label: "Visitor",
    table: t.diaryVisitors,
    create: s.diaryVisitorCreateSchema,
    update: s.diaryVisitorUpdateSchema,
    action: "diary.write",
    parent: diaryParent,
    frozenBy: null,
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: [],
  },
  "site-visits": {
    type: "site-visits",
    label: "Site visit",
    table: t.siteVisits,
    create: s.siteVisitCreateSchema,
    update: s.siteVisitUpdateSchema,
    action: "visit.write",
    refs: [{ field: "placementIds", type: "placements" }],
    frozenBy: "visit",
    dateField: "visitDate",
    dateKind: "date",
    mergeable: ["arrivedAt", "leftAt"],
  },
  findings: {
    type: "findings",
    label: "Finding",
    table: t.findings,
    create: s.findingCreateSchema,
    update: s.findingUpdateSchema,
    action: "visit.write",
    parent: { field: "siteVisitId", type: "site-visits" },
    refs: [placementLink],
    frozenBy: "siteVisitId",
    dateField: "createdAt",
    dateKind: "instant",
    mergeable: ["severity", "dueDate"],
    deleteBlocked: (row) =>
      row.state === "open" && !row.answeredAt ? null : "This finding has been answered; close it (or reopen it) instead of deleting it.",
  },
  photos: {
    type: "photos",
    label: "Photo",
    table: t.photos,
    create: s.photoCreateSchema,
    update: s.photoUpdateSchema,
    action: "photo.add",
    target: { typeField: "recordType", idField: "recordId" },
    frozenBy: "record",
    dateField: "createdAt",
    dateKind: "instant",
    compute: computePhoto,
    // The caption is free text: never merged.
    mergeable: [],
  },
};

export function isRecordType(value: string): value is RecordType {
  return (RECORD_TYPES as readonly string[]).includes(value);
}

/** The description of a record type; an unknown type is a 404 (it is part of the URL). */
export function getRecordDef(type: string): RecordDef {
  if (!isRecordType(type)) throw notFound("Record type");
  return DEFS[type];
}

/** Record types that point at any record through a typed link (photos), tombstoned with it. */
export function targetingTypes(): RecordDef[] {
  return RECORD_TYPES.map((other) => DEFS[other]).filter((def) => def.target !== undefined);
}

/** Record types whose parent is `type` (tombstoned with it). */
export function childTypes(type: RecordType): RecordDef[] {
  return RECORD_TYPES.map((other) => DEFS[other]).filter((def) => def.parent?.type === type);
}

/** A column of a record table by its field name (the registry is typed loosely on purpose). */
export function column(def: RecordDef, field: string): AnyPgColumn {
  const col = (def.table as unknown as Record<string, AnyPgColumn | undefined>)[field];
  if (!col) throw new Error(`${def.type} has no column ${field}`);
  return col;
}
