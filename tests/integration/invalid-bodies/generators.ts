// Property: generated invalid bodies sent to the write routes always get a 400 that names a field,
// never a 5xx, and change no rows. The generator knows each record's fields and their limits and
// produces only values that break them (wrong type, out of range, too long, unknown choice, bad id,
// bad or offset-less time, missing required field, times out of order).
// This module holds each record's fields and limits, the generators of bad values, and the checks.
import fc from "fast-check";
import { getTableName } from "drizzle-orm";
import { getRecordDef, type RecordType } from "@/lib/records/registry";
import { countRows } from "../helpers";
import { RECORD_TYPES } from "../record-fixtures";

type Spec =
  | { k: "num"; min: number; max: number; int?: boolean; minExclusive?: boolean }
  | { k: "text"; max: number }
  | { k: "enum"; values: readonly string[] }
  | { k: "literal"; values: readonly number[] }
  | { k: "id" }
  | { k: "instant" }
  | { k: "date" }
  | { k: "bool" }
  | { k: "ints"; min: number; max: number; maxItems: number }
  | { k: "readings" };
type Field = Spec & { required?: boolean; nullable?: boolean; createOnly?: boolean };

const req = <T extends Spec>(s: T): Field => ({ ...s, required: true });
const opt = <T extends Spec>(s: T): Field => ({ ...s });
const nul = <T extends Spec>(s: T): Field => ({ ...s, nullable: true });
const parent = (): Field => ({ k: "id", required: true, createOnly: true });
const num = (min: number, max: number, int = false): Spec => ({ k: "num", min, max, int });
const text = (max: number): Spec => ({ k: "text", max });
const temp = num(-40, 70);

export const FIELDS: Record<RecordType, Record<string, Field>> = {
  "mix-designs": {
    code: req(text(32)), supplier: opt(text(120)), fcMPa: req(num(10, 150)), fcAgeDays: req({ k: "literal", values: [28, 56] }),
    maxWcm: nul(num(0.2, 0.8)), slumpTargetMm: nul(num(0, 300)), slumpType: opt({ k: "enum", values: ["target", "maximum"] }),
    slumpToleranceMm: nul(num(0, 100)), airTargetPct: nul(num(0, 12)), airTolerancePct: nul(num(0, 5)), maxConcreteTempC: nul(temp),
    cementType: opt(text(60)), scms: opt(text(500)), siteWaterAllowedLPerM3: opt(num(0, 50)), lowBleed: opt({ k: "bool" }),
  },
  placements: {
    element: req(text(120)), level: opt(text(60)), grid: opt(text(60)),
    elementType: req({ k: "enum", values: ["footing", "wall", "column", "beam", "slab-on-ground", "elevated-slab", "other"] }),
    leastDimensionMm: nul(num(25, 10_000)), plannedVolumeM3: nul(num(0, 5_000)), mixId: nul({ k: "id" }), plannedStart: req({ k: "instant" }),
  },
  deliveries: {
    placementId: parent(), ticketNumber: req(text(40)), truck: opt(text(40)), volumeM3: req(num(0, 20)),
    batchedAt: req({ k: "instant" }), arrivedAt: req({ k: "instant" }), dischargeStartedAt: nul({ k: "instant" }), dischargeFinishedAt: nul({ k: "instant" }),
    revolutions: nul(num(0, 2_000, true)), waterAddedL: nul(num(0, 2_000)), waterFirstAt: nul({ k: "instant" }), waterLastAt: nul({ k: "instant" }),
    waterAddedBy: nul(text(120)), waterAuthorisedBy: nul(text(120)), admixtureNote: nul(text(1_000)),
    status: opt({ k: "enum", values: ["accepted", "rejected"] }), rejectReason: nul(text(1_000)),
  },
  "field-tests": {
    placementId: parent(), deliveryId: nul({ k: "id" }), sampledAt: req({ k: "instant" }), slumpMm: nul(num(0, 300)), slumpFlowMm: nul(num(0, 1_000)),
    airPct: nul(num(0, 20)), concreteTempC: nul(temp), airTempC: nul(temp), densityKgM3: nul(num(500, 4_000)), notes: nul(text(2_000)),
  },
  "specimen-sets": {
    placementId: parent(), deliveryId: nul({ k: "id" }), setCode: req(text(40)), cylinderDiameterMm: req({ k: "literal", values: [100, 150] }),
    cylinderLengthMm: req(num(100, 400)), count: req(num(1, 24, true)), castAt: req({ k: "instant" }),
    initialCuringMinC: nul(temp), initialCuringMaxC: nul(temp), testAgesDays: req({ k: "ints", min: 1, max: 365, maxItems: 10 }),
  },
  breaks: {
    specimenSetId: parent(), testedAt: req({ k: "instant" }), ageDays: req(num(0, 400, true)),
    loadKN: req({ k: "num", min: 0, max: 5_000, minExclusive: true }), diameterMm: req(num(50, 200)), lengthMm: nul(num(50, 450)), fractureType: nul(num(1, 6, true)),
  },
  "weather-observations": {
    placementId: { k: "id", nullable: true, createOnly: true }, observedAt: req({ k: "instant" }), airTempC: req(temp),
    relativeHumidityPct: req(num(0, 100)), windKmh: req(num(0, 200)), concreteTempC: nul(temp), sun: nul({ k: "enum", values: ["sun", "shade", "overcast"] }),
  },
  checklists: { placementId: parent(), kind: req({ k: "enum", values: ["readiness", "hot-weather", "cold-weather"] }) },
  "checklist-items": {
    checklistId: parent(), itemKey: req(text(60)), label: req(text(200)), answer: nul({ k: "enum", values: ["yes", "no", "na"] }), note: nul(text(1_000)),
  },
  "curing-readings": { placementId: parent(), method: req(text(80)), readAt: req({ k: "instant" }), tempC: req(temp), location: opt(text(120)), note: nul(text(1_000)) },
  "diary-entries": { date: req({ k: "date" }), weatherSummary: opt(text(500)), workDone: opt(text(5_000)), safetyNotes: opt(text(2_000)) },
  "diary-crew": { diaryEntryId: parent(), trade: req(text(80)), count: req(num(0, 500, true)) },
  "diary-equipment": { diaryEntryId: parent(), name: req(text(80)), count: nul(num(0, 100, true)), hours: nul(num(0, 1_000)) },
  "diary-delays": { diaryEntryId: parent(), cause: req(text(80)), minutes: req(num(0, 1_440, true)), description: opt(text(1_000)) },
  "diary-visitors": { diaryEntryId: parent(), name: req(text(120)), company: opt(text(120)), purpose: opt(text(300)) },
  "site-visits": {
    visitDate: req({ k: "date" }), arrivedAt: nul({ k: "instant" }), leftAt: nul({ k: "instant" }), areasInspected: opt(text(2_000)),
    elementsInspected: opt(text(2_000)), testsWitnessed: opt(text(2_000)), weather: opt(text(300)), notes: opt(text(5_000)),
  },
  findings: {
    siteVisitId: parent(), placementId: nul({ k: "id" }), description: req(text(2_000)), location: opt(text(200)),
    severity: req({ k: "enum", values: ["minor", "major", "critical"] }), requirement: opt(text(300)), actionRequired: opt(text(2_000)), dueDate: nul({ k: "date" }),
  },
  photos: {
    recordType: { k: "enum", values: ["placements", "deliveries", "field-tests", "weather-observations", "checklist-items", "curing-readings", "diary-entries", "amendments"], required: true, createOnly: true },
    recordId: parent(), caption: opt(text(500)), takenAt: { k: "instant", nullable: true, createOnly: true },
    // A SHA-256 is 64 hex digits: none of the bad ids (non-strings, short strings, a cut GUID) is one.
    sha256: { k: "id", required: true, createOnly: true },
    sizeBytes: { k: "num", min: 1, max: 15 * 1024 * 1024, int: true, required: true, createOnly: true },
    contentType: { k: "enum", values: ["image/jpeg", "image/png", "image/webp"], required: true, createOnly: true },
  },
  "temperature-sensors": {
    placementId: parent(), name: req(text(80)), location: opt(text(160)), loggingIntervalMinutes: nul(num(1, 1_440, true)), endedAt: nul({ k: "instant" }), note: nul(text(1_000)),
  },
  "sensor-readings": {
    sensorId: parent(), source: { k: "enum", values: ["manual", "import"], required: true, createOnly: true },
    readings: req({ k: "readings" }),
  },
};

const GUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const notObject = fc.oneof(fc.constant([]), fc.constant(["x"]), fc.constant({ value: 1 }));
const notNumber = fc.oneof(fc.string({ maxLength: 8 }), fc.boolean(), notObject, fc.integer().map(String));
export const notString = fc.oneof(fc.integer(), fc.boolean(), notObject);
const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

export function badValue(spec: Field): fc.Arbitrary<unknown> {
  const options: fc.Arbitrary<unknown>[] = [];
  if (!spec.nullable) options.push(fc.constant(null));
  switch (spec.k) {
    case "num": {
      options.push(notNumber, finite(spec.max + 0.001, spec.max * 10 + 1_000));
      options.push(spec.minExclusive ? finite(spec.min - 1_000, spec.min) : finite(spec.min - 1_000, spec.min - 0.001));
      if (spec.int) options.push(fc.integer({ min: spec.min, max: spec.max - 1 }).map((n) => n + 0.5));
      break;
    }
    case "text":
      options.push(notString, fc.integer({ min: spec.max + 1, max: spec.max + 40 }).map((n) => "x".repeat(n)));
      if (spec.required) options.push(fc.constantFrom("", "   "));
      break;
    case "enum":
      options.push(notString, fc.string({ maxLength: 12 }).filter((s) => !spec.values.includes(s)), fc.constantFrom(...spec.values.map((v) => v.toUpperCase() + "!")));
      break;
    case "literal":
      options.push(notNumber, fc.integer({ min: -5, max: 500 }).filter((n) => !spec.values.includes(n)));
      break;
    case "id":
      options.push(notString, fc.string({ maxLength: 40 }).filter((s) => !GUID.test(s)), fc.constant("6f1c3e20-8d44-4b7e-b1a2"));
      break;
    case "instant":
      options.push(
        fc.integer(),
        fc.boolean(),
        fc.string({ maxLength: 20 }),
        fc.constantFrom("2026-11-09T10:00:00", "2026-11-09", "1999-12-31T23:00:00Z", "2150-01-01T00:00:00Z", "2026-13-01T00:00:00Z", "9 Nov 2026 10:00"),
      );
      break;
    case "date":
      options.push(fc.integer(), fc.string({ maxLength: 12 }).filter((s) => !/^\d{4}-\d{2}-\d{2}$/.test(s)), fc.constantFrom("2026-02-30", "11/09/2026", "2026-11-09T00:00:00Z"));
      break;
    case "bool":
      options.push(fc.constantFrom("yes", "true", 1, 0), notObject);
      break;
    case "ints":
      options.push(
        notNumber.filter((v) => !Array.isArray(v)),
        fc.constant([]),
        fc.array(fc.integer({ min: spec.min, max: spec.max }), { minLength: spec.maxItems + 1, maxLength: spec.maxItems + 3 }),
        fc.tuple(fc.integer({ min: spec.max + 1, max: 10_000 })).map((a) => [7, ...a]),
        fc.constant([7, 28.5]),
        fc.constant(["7"]),
      );
      break;
    case "readings":
      options.push(
        notNumber.filter((v) => !Array.isArray(v)),
        fc.constant([]),
        fc.constant([["2026-11-16T10:00:00", 12]]),
        fc.constant([["2026-11-16T10:00:00Z", 90]]),
        fc.constant([["2026-11-16T10:00:00Z", "12"]]),
        fc.constant([["2026-11-16T11:00:00Z", 12], ["2026-11-16T10:00:00Z", 12]]),
        fc.constant(Array.from({ length: 1_001 }, (_, i) => [new Date(Date.UTC(2026, 10, 16) + i * 60_000).toISOString(), 12])),
      );
      break;
  }
  return fc.oneof(...options);
}

export const MISSING = Symbol("missing");
export type Mutation = { field: string; value: unknown };

/** 1–3 distinct fields of the record, each given a value that breaks its rule (or removed when required). */
export function mutations(type: RecordType, mode: "create" | "patch"): fc.Arbitrary<Mutation[]> {
  const eligible = Object.entries(FIELDS[type]).filter(([, spec]) => mode === "create" || !spec.createOnly);
  if (mode === "create") eligible.push(["id", { k: "id", required: true }]);
  const one = fc.constantFrom(...eligible).chain(([field, spec]) => {
    const bad = badValue(spec);
    const value = mode === "create" && spec.required ? fc.oneof(bad, fc.constant(MISSING)) : bad;
    return value.map((v) => ({ field, value: v }));
  });
  return fc.uniqueArray(one, { minLength: 1, maxLength: 3, selector: (m) => m.field });
}

/** Rules between fields: each breaks one, and the field it names. */
export const CROSS: Partial<Record<RecordType, { body: Record<string, unknown>; field: string }[]>> = {
  deliveries: [
    { body: { batchedAt: "2026-11-16T10:00:00-06:00", arrivedAt: "2026-11-16T09:59:00-06:00" }, field: "arrivedAt" },
    { body: { dischargeStartedAt: "2026-11-16T08:20:00-06:00" }, field: "dischargeStartedAt" },
    { body: { dischargeFinishedAt: "2026-11-16T08:31:00-06:00" }, field: "dischargeFinishedAt" },
    { body: { status: "rejected", rejectReason: null }, field: "rejectReason" },
    { body: { waterAddedL: 30, waterFirstAt: null }, field: "waterFirstAt" },
  ],
  "specimen-sets": [{ body: { initialCuringMinC: 25, initialCuringMaxC: 20 }, field: "initialCuringMaxC" }],
  "field-tests": [{ body: { slumpMm: null, airPct: null, concreteTempC: null, densityKgM3: null }, field: "slumpMm" }],
  "site-visits": [{ body: { arrivedAt: "2026-11-16T10:00:00-06:00", leftAt: "2026-11-16T09:00:00-06:00" }, field: "leftAt" }],
};

const WATCHED = [...RECORD_TYPES.map((type) => getTableName(getRecordDef(type).table)), "audit_entries", "project_change_counters"];
export async function counts() {
  return Object.fromEntries(await Promise.all(WATCHED.map(async (t) => [t, await countRows(t)] as const)));
}

export function expect400(res: { status: number; json: { error?: { code?: string; fields?: Record<string, string> } } }, fields: string[]) {
  const names = Object.keys(res.json?.error?.fields ?? {});
  const named = names.some((n) => fields.some((f) => n === f || n.startsWith(`${f}.`)));
  if (res.status !== 400 || res.json.error?.code !== "invalid_input" || !named) {
    throw new Error(`expected 400 naming one of ${fields.join(", ")}; got ${res.status} ${JSON.stringify(res.json)}`);
  }
}
