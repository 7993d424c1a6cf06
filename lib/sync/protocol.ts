// The wire format of offline sync (see DEVELOPERS.md and SYNC.md), shared by the device (lib/sync/client)
// and the server (lib/sync/server). Every field write is one mutation; the server applies a device's
// mutations in order, once each, and answers each with applied, conflict or rejected.
import { z } from "zod";
import { RECORD_TYPES } from "@/lib/records/record-types";

/** Bumped when the local store or the wire format changes; a mismatch makes the pull reset. */
// 2: photos became a synced record type (a device that synced before pulls them all again).
// 4: a ticket's mix code, why a truck went onto work not cleared, and who ran a field test (new fields; a device pulls every record again).
// 5: a specimen set's logger (sensorId; a device pulls every record again).
export const SYNC_SCHEMA_VERSION = 5;
export const MAX_MUTATIONS_PER_PUSH = 100;
export const MAX_CHANGES_PER_PULL = 500;
/**
 * A change's arguments as JSON, in bytes. The largest record a form makes is a few kilobytes (free
 * text is capped at 500 characters per field); 100 changes at the cap still fit a push body.
 */
export const MAX_MUTATION_ARGS_BYTES = 16 * 1024;

export const MUTATION_NAMES = ["create", "update", "delete", "transition", "resolve"] as const;
export type MutationName = (typeof MUTATION_NAMES)[number];

const uuid = z.uuid("Must be an id made by the device (UUID)");

/**
 * One change made on a device.
 * - create:     args = the record's create input (with its client id == recordId)
 * - update:     args = { patch }, baseVersion = the version the device edited
 * - delete:     args = {}, baseVersion
 * - transition: args = { to, reason? } (placements only), baseVersion
 * - resolve:    args = { conflictId, patch? } — a person's answer to a conflict: the patch (the values
 *               kept, field by field) is applied onto the server version given as baseVersion, and the
 *               conflict is closed; an empty patch keeps the server's values.
 */
export const mutationSchema = z.object({
  id: z.number().int().min(1, "Mutation ids start at 1"),
  name: z.enum(MUTATION_NAMES, { error: "Unknown mutation" }),
  recordType: z.enum(RECORD_TYPES, { error: "Unknown record type" }),
  projectId: uuid,
  recordId: uuid,
  args: z
    .record(z.string(), z.unknown())
    .default({})
    .refine((args) => new TextEncoder().encode(JSON.stringify(args)).length <= MAX_MUTATION_ARGS_BYTES, {
      error: `A change is too large (at most ${MAX_MUTATION_ARGS_BYTES / 1024} KB); nothing was saved.`,
    }),
  baseVersion: z.number().int().min(1).optional(),
});
export type Mutation = z.infer<typeof mutationSchema>;

export const pushRequestSchema = z.object({
  clientId: uuid,
  schemaVersion: z.number().int(),
  mutations: z
    .array(mutationSchema)
    .max(MAX_MUTATIONS_PER_PUSH, `Send at most ${MAX_MUTATIONS_PER_PUSH} changes at a time`),
});
export type PushRequest = z.infer<typeof pushRequestSchema>;

export type MutationOutcome = "applied" | "conflict" | "rejected";
export type MutationResult = {
  id: number;
  result: MutationOutcome;
  /** The record's version after an applied change. */
  version?: number;
  conflictId?: string;
  /** Machine reason: stale, exists, signed, forbidden, invalid, not_found, rule … */
  reason?: string;
  /** A sentence for the person on the device. */
  message?: string;
};
export type PushResponse = { lastMutationId: number; results: MutationResult[] };
/** A 409 answer when the batch skips ids: nothing after the gap was applied. */
export type PushGapError = { error: { code: "conflict"; reason: "gap"; message: string; expectedId: number } };

/** The pull cursor: the last change number the device has, per project (change numbers are per project). */
export const cursorSchema = z.record(z.string(), z.number().int().min(0));
export type Cursor = z.infer<typeof cursorSchema>;

export const pullRequestSchema = z.object({
  clientId: uuid,
  schemaVersion: z.number().int(),
  cursor: cursorSchema.nullable().default(null),
  limit: z.number().int().min(1).max(MAX_CHANGES_PER_PULL).optional(),
  /** Every change up to this id has left the device's outbox (lets the server prune their results). */
  ackedMutationId: z.number().int().min(0).optional(),
});
export type PullRequest = z.infer<typeof pullRequestSchema>;

/** A record as the server stores it (JSON: dates as ISO strings), tombstones included. */
export type SyncedRecord = {
  id: string;
  projectId: string;
  version: number;
  changeSeq: number;
  deletedAt: string | null;
  [field: string]: unknown;
};

export type RecordChange = { recordType: (typeof RECORD_TYPES)[number]; record: SyncedRecord };

export type SyncProject = {
  id: string;
  name: string;
  code: string;
  role: "superintendent" | "inspector" | "office" | "owner";
  unitSystem: "SI" | "IP";
  timeZone: string;
  [setting: string]: unknown;
};

export type ConflictSummary = {
  id: string;
  projectId: string;
  recordType: string;
  recordId: string;
  baseVersion: number | null;
  serverVersion: number | null;
  clientPayload: unknown;
  serverPayload: unknown;
  reason: string;
  createdAt: string;
};

export type PullResponse = {
  /** True when the device must drop its synced copies and take this (paged) snapshot instead. */
  reset: boolean;
  cursor: Cursor;
  hasMore: boolean;
  changes: RecordChange[];
  projects: SyncProject[];
  conflicts: ConflictSummary[];
  lastMutationId: number;
};
