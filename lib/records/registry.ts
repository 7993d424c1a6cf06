// Every record type the field and the office write, as the server sees it: the shared description
// (lib/records/descriptions.ts) extended with its table, who writes it, how it hangs off a placement
// (for the signed freeze) and how lists are ordered. Types: lib/records/record-def.ts.
import { getTableColumns } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import * as t from "@/db/schema";
import { notFound } from "@/lib/errors";
import { computeBreak, computePhoto, computeWeather } from "./compute";
import { RECORD_DESCRIPTIONS } from "./descriptions";
import type { Link, RecordDef, ServerPart } from "./record-def";
import { RECORD_TYPES, type RecordType } from "./record-types";

export { RECORD_TYPES, type RecordType } from "./record-types";
export type { RecordDef, SyncedTable } from "./record-def";

const placementLink: Link = { field: "placementId", type: "placements" };
const deliveryRef: Link = { field: "deliveryId", type: "deliveries", samePlacement: true };

/** The shared description of `type` extended with the server's part. */
function server(type: RecordType, part: ServerPart): RecordDef {
  return { dateField: "createdAt", dateKind: "instant", ...RECORD_DESCRIPTIONS[type], ...part };
}

const DEFS: Record<RecordType, RecordDef> = {
  "mix-designs": server("mix-designs", {
    table: t.mixDesigns,
    action: "mix.write",
    frozenBy: null,
    unique: { index: "mix_designs_project_code_idx", field: "code", message: "This project already has a mix with this code" },
  }),
  placements: server("placements", {
    table: t.placements,
    action: "placement.write",
    refs: [{ field: "mixId", type: "mix-designs" }],
    frozenBy: "self",
    dateField: "plannedStart",
    deleteBlocked: (row) =>
      ["placing", "placed", "signed"].includes(row.state as string)
        ? "Concrete has been placed here, so the placement cannot be deleted; correct it instead."
        : null,
  }),
  deliveries: server("deliveries", { table: t.deliveries, action: "delivery.write", frozenBy: "placementId", dateField: "arrivedAt" }),
  "field-tests": server("field-tests", {
    table: t.fieldTests,
    action: "fieldTest.write",
    refs: [deliveryRef],
    frozenBy: "placementId",
    dateField: "sampledAt",
  }),
  "specimen-sets": server("specimen-sets", {
    table: t.specimenSets,
    action: "specimen.write",
    // The logger cured with the set must be a sensor of the set's placement (same project).
    refs: [deliveryRef, { field: "sensorId", type: "temperature-sensors", samePlacement: true }],
    frozenBy: "placementId",
    dateField: "castAt",
  }),
  // Breaks come weeks after the sign-off of the placement; they are the lab's, not frozen by it.
  breaks: server("breaks", { table: t.breaks, action: "break.write", frozenBy: null, dateField: "testedAt", compute: computeBreak }),
  "weather-observations": server("weather-observations", {
    table: t.weatherObservations,
    action: "weather.write",
    frozenBy: "placementId",
    dateField: "observedAt",
    compute: computeWeather,
  }),
  checklists: server("checklists", { table: t.checklists, action: "checklist.write", frozenBy: "placementId" }),
  "checklist-items": server("checklist-items", { table: t.checklistItems, action: "checklist.write", frozenBy: "checklist" }),
  "curing-readings": server("curing-readings", { table: t.curingReadings, action: "curing.write", frozenBy: "placementId", dateField: "readAt" }),
  // Temperature records for the maturity method: not frozen by the placement's signature, since the
  // record runs for days after the pour is signed; written by those who keep the curing log.
  "temperature-sensors": server("temperature-sensors", { table: t.temperatureSensors, action: "curing.write", frozenBy: null }),
  "sensor-readings": server("sensor-readings", { table: t.sensorReadings, action: "curing.write", frozenBy: null, dateField: "firstAt" }),
  "diary-entries": server("diary-entries", {
    table: t.diaryEntries,
    action: "diary.write",
    frozenBy: null,
    dateField: "date",
    dateKind: "date",
    unique: { index: "diary_entries_project_date_idx", field: "date", message: "There is already a diary for this date; add to that one" },
  }),
  "diary-crew": server("diary-crew", { table: t.diaryCrew, action: "diary.write", frozenBy: null }),
  "diary-equipment": server("diary-equipment", { table: t.diaryEquipment, action: "diary.write", frozenBy: null }),
  "diary-delays": server("diary-delays", { table: t.diaryDelays, action: "diary.write", frozenBy: null }),
  "diary-visitors": server("diary-visitors", { table: t.diaryVisitors, action: "diary.write", frozenBy: null }),
  "site-visits": server("site-visits", {
    table: t.siteVisits,
    action: "visit.write",
    refs: [{ field: "placementIds", type: "placements" }],
    frozenBy: "visit",
    dateField: "visitDate",
    dateKind: "date",
  }),
  findings: server("findings", {
    table: t.findings,
    action: "visit.write",
    refs: [placementLink],
    frozenBy: "siteVisitId",
    deleteBlocked: (row) =>
      row.state === "open" && !row.answeredAt ? null : "This finding has been answered; close it (or reopen it) instead of deleting it.",
  }),
  photos: server("photos", {
    table: t.photos,
    action: "photo.add",
    target: { typeField: "recordType", idField: "recordId" },
    frozenBy: "record",
    compute: computePhoto,
  }),
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

/** Record types whose parent is `type` and that are tombstoned with it (an optional parent is not). */
export function childTypes(type: RecordType): RecordDef[] {
  return RECORD_TYPES.map((other) => DEFS[other]).filter((def) => def.parent?.type === type && !def.parent.optional);
}

/** A column of a record table by its field name (the registry is typed loosely on purpose). */
export function column(def: RecordDef, field: string): AnyPgColumn {
  const col: AnyPgColumn | undefined = getTableColumns(def.table)[field];
  if (!col) throw new Error(`${def.type} has no column ${field}`);
  return col;
}
