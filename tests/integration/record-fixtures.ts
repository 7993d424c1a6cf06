// Valid bodies for every record type, and helpers that create a record with its parents through
// the real write path (lib/records), as a role that may write it.
import { randomUUID } from "node:crypto";
import type { ProjectRole } from "@/lib/auth/roles";
import { createRecord } from "@/lib/records/write";
import { RECORD_TYPES, type RecordType } from "@/lib/records/registry";
import type { RecordRow } from "@/lib/records/types";
import type { TestUser } from "./helpers";

export { RECORD_TYPES };
export type Team = Record<ProjectRole, TestUser>;

/** A role that writes each type in the normal course of work (the office may write all of them). */
export const WRITER: Record<RecordType, ProjectRole> = {
  "mix-designs": "office",
  placements: "superintendent",
  deliveries: "superintendent",
  "field-tests": "inspector",
  "specimen-sets": "inspector",
  breaks: "office",
  "weather-observations": "superintendent",
  checklists: "inspector",
  "checklist-items": "inspector",
  "curing-readings": "superintendent",
  "diary-entries": "superintendent",
  "diary-crew": "superintendent",
  "diary-equipment": "superintendent",
  "diary-delays": "superintendent",
  "diary-visitors": "superintendent",
  "site-visits": "inspector",
  findings: "inspector",
  photos: "superintendent",
  "temperature-sensors": "superintendent",
  "sensor-readings": "superintendent",
};

/** Roles that may create, update and delete each type (the expected outcomes, written out). */
export const WRITERS: Record<RecordType, ProjectRole[]> = {
  "mix-designs": ["office"],
  placements: ["superintendent", "office"],
  deliveries: ["superintendent", "office"],
  "field-tests": ["inspector", "office"],
  "specimen-sets": ["inspector", "office"],
  breaks: ["office"],
  "weather-observations": ["superintendent", "inspector", "office"],
  checklists: ["superintendent", "inspector", "office"],
  "checklist-items": ["superintendent", "inspector", "office"],
  "curing-readings": ["superintendent", "office"],
  "diary-entries": ["superintendent", "office"],
  "diary-crew": ["superintendent", "office"],
  "diary-equipment": ["superintendent", "office"],
  "diary-delays": ["superintendent", "office"],
  "diary-visitors": ["superintendent", "office"],
  "site-visits": ["inspector", "office"],
  findings: ["inspector", "office"],
  // "photo.add" (lib/auth/can): the field and the office; owners only view.
  photos: ["superintendent", "inspector", "office"],
  // "curing.write": the superintendent keeps the temperature record, as the curing log.
  "temperature-sensors": ["superintendent", "office"],
  "sensor-readings": ["superintendent", "office"],
};

// Mid-November 2026 in Chicago (CST, UTC−6), like the demo scenario.
export const T0 = Date.parse("2026-11-16T08:00:00-06:00");
export const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();

// Each diary entry needs its own date within a project.
let diaryDay = 0;
const nextDiaryDate = () => new Date(Date.UTC(2031, 0, 1) + diaryDay++ * 86_400_000).toISOString().slice(0, 10);

const PARENT_TYPE: Partial<Record<RecordType, { field: string; type: RecordType }>> = {
  deliveries: { field: "placementId", type: "placements" },
  "field-tests": { field: "placementId", type: "placements" },
  "specimen-sets": { field: "placementId", type: "placements" },
  breaks: { field: "specimenSetId", type: "specimen-sets" },
  "weather-observations": { field: "placementId", type: "placements" },
  checklists: { field: "placementId", type: "placements" },
  "checklist-items": { field: "checklistId", type: "checklists" },
  "curing-readings": { field: "placementId", type: "placements" },
  "diary-crew": { field: "diaryEntryId", type: "diary-entries" },
  "diary-equipment": { field: "diaryEntryId", type: "diary-entries" },
  "diary-delays": { field: "diaryEntryId", type: "diary-entries" },
  "diary-visitors": { field: "diaryEntryId", type: "diary-entries" },
  findings: { field: "siteVisitId", type: "site-visits" },
  // A photo points at any record by type and id; the fixtures use a delivery.
  photos: { field: "recordId", type: "deliveries" },
  "temperature-sensors": { field: "placementId", type: "placements" },
  "sensor-readings": { field: "sensorId", type: "temperature-sensors" },
};

/** A valid create body; `parentId` fills the parent field, if the type has one. */
export function validBody(type: RecordType, parentId?: string): Record<string, unknown> {
  const id = randomUUID();
  const tag = id.slice(0, 6).toUpperCase();
  const parent = PARENT_TYPE[type];
  const link = parent ? { [parent.field]: parentId } : {};
  switch (type) {
    case "mix-designs":
      return { id, code: `M-${tag}`, supplier: "Brindlewood Ready-Mix", fcMPa: 32, fcAgeDays: 28, slumpTargetMm: 100, slumpType: "target", airTargetPct: 5, lowBleed: false };
    case "placements":
      return { id, element: `Slab ${tag}`, level: "L2", grid: "A-D/1-4", elementType: "elevated-slab", leastDimensionMm: 250, plannedVolumeM3: 60, plannedStart: at(0) };
    case "deliveries":
      return { ...link, id, ticketNumber: `T-${tag}`, truck: "B-17", volumeM3: 8, batchedAt: at(0), arrivedAt: at(30), dischargeStartedAt: at(35), dischargeFinishedAt: at(60) };
    case "field-tests":
      return { ...link, id, sampledAt: at(40), slumpMm: 100, airPct: 5.5, concreteTempC: 24, airTempC: 20, densityKgM3: 2350 };
    case "specimen-sets":
      return { ...link, id, setCode: `S-${tag}`, cylinderDiameterMm: 100, cylinderLengthMm: 200, count: 6, castAt: at(50), initialCuringMinC: 18, initialCuringMaxC: 24, testAgesDays: [7, 28] };
    case "breaks":
      return { ...link, id, testedAt: at(7 * 24 * 60), ageDays: 7, loadKN: 180, diameterMm: 100, lengthMm: 200, fractureType: 2 };
    case "weather-observations":
      return { ...link, id, observedAt: at(120), airTempC: 30, relativeHumidityPct: 40, windKmh: 20, concreteTempC: 28, sun: "sun" };
    case "checklists":
      return { ...link, id, kind: "readiness" };
    case "checklist-items":
      return { ...link, id, itemKey: `forms-${tag}`, label: "Forms tight and clean", answer: "yes" };
    case "curing-readings":
      return { ...link, id, method: "Insulated blankets", readAt: at(600), tempC: 14, location: "North edge" };
    case "diary-entries":
      return { id, date: nextDiaryDate(), weatherSummary: "Clear, 12 °C", workDone: "Formed the L3 deck edge", safetyNotes: "" };
    case "diary-crew":
      return { ...link, id, trade: "Finishers", count: 6 };
    case "diary-equipment":
      return { ...link, id, name: "Boom pump 42 m", count: 1, hours: 6 };
    case "diary-delays":
      return { ...link, id, cause: "Late truck", minutes: 35, description: "Truck 4 stuck at the rail crossing" };
    case "diary-visitors":
      return { ...link, id, name: "R. Quill", company: "Fenwick Hollow Materials Lab", purpose: "Cylinder pick-up" };
    case "site-visits":
      return { id, visitDate: "2026-11-16", arrivedAt: at(0), leftAt: at(150), areasInspected: "Podium, grid A-D/1-4", elementsInspected: "Slab reinforcement", testsWitnessed: "", weather: "Overcast, 8 °C", notes: "" };
    case "findings":
      return { ...link, id, description: "Bottom bar cover 25 mm where 40 mm is specified", location: "Grid C/3", severity: "major", requirement: "Spec 03 30 00 §3.2; S-201 note 4", actionRequired: "Raise the chairs and show me before the pour", dueDate: "2026-11-17" };
    case "photos":
      return { ...link, id, recordType: "deliveries", caption: "Slump cone, truck B-17", takenAt: at(40), sha256: "ab".repeat(32), sizeBytes: 412_345, contentType: "image/jpeg" };
    case "temperature-sensors":
      return { ...link, id, name: `T-${tag}`, location: "East edge, mid-depth", loggingIntervalMinutes: 15 };
    case "sensor-readings":
      return { ...link, id, source: "manual", readings: [[at(600), 14.5], [at(615), 14]] };
  }
}

/** A valid patch of each type, with the field it changes. */
export const PATCHES: Record<RecordType, Record<string, unknown>> = {
  "mix-designs": { fcMPa: 35, supplier: "Brindlewood Ready-Mix, plant 2" },
  placements: { plannedVolumeM3: 64.5, grid: "A-E/1-4" },
  deliveries: { waterAddedL: 40, waterFirstAt: at(32), waterLastAt: at(34), waterAddedBy: "Driver", waterAuthorisedBy: "Sam Okafor" },
  "field-tests": { slumpMm: 110, notes: "Check test" },
  "specimen-sets": { count: 5 },
  breaks: { loadKN: 200 },
  "weather-observations": { windKmh: 10 },
  checklists: { kind: "hot-weather" },
  "checklist-items": { answer: "no", note: "Gap at C/4" },
  "curing-readings": { tempC: 11.5 },
  "diary-entries": { workDone: "Formed and poured the L3 deck edge" },
  "diary-crew": { count: 7 },
  "diary-equipment": { hours: 7.5 },
  "diary-delays": { minutes: 40 },
  "diary-visitors": { purpose: "Audit of the curing box" },
  "site-visits": { notes: "Pre-pour walk with the superintendent", leftAt: at(180) },
  findings: { severity: "critical", location: "Grid C/3 to C/4" },
  photos: { caption: "Slump cone, truck B-17, after the water addition" },
  "temperature-sensors": { loggingIntervalMinutes: 30 },
  "sensor-readings": { readings: [[at(600), 14.5], [at(615), 13.5]] },
};

export function parentOf(type: RecordType) {
  return PARENT_TYPE[type];
}

/** Creates a record through lib as its usual writer, creating a parent chain first when needed. */
export async function makeRecord(
  type: RecordType,
  projectId: string,
  team: Team,
  overrides: Record<string, unknown> = {},
): Promise<RecordRow> {
  const parent = PARENT_TYPE[type];
  const parentId =
    parent && overrides[parent.field] === undefined ? (await makeRecord(parent.type, projectId, team)).id : (overrides[parent?.field ?? ""] as string | undefined);
  const body = { ...validBody(type, parentId), ...overrides };
  const { record } = await createRecord({ user: team[WRITER[type]] }, type, projectId, body);
  return record;
}

/** A valid create body with its parents already created. */
export async function bodyWithParents(type: RecordType, projectId: string, team: Team) {
  const parent = PARENT_TYPE[type];
  const parentId = parent ? (await makeRecord(parent.type, projectId, team)).id : undefined;
  return validBody(type, parentId);
}
