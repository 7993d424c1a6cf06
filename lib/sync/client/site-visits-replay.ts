// How a lifecycle move of a visit report or a finding shows on the device before the server answers:
// the same fields the server sets (lib/site-visits/lifecycle moveEffect), as wire values.
import { findMove, lifecycleArgsSchema, moveEffect, type LifecycleType } from "@/lib/site-visits/lifecycle";
import type { SyncedRecord } from "@/lib/sync/protocol";
import type { OutboxEntry } from "./db";

export function applyLifecycleEntry(row: SyncedRecord, entry: OutboxEntry, userId: string | null): SyncedRecord {
  const type = entry.recordType as LifecycleType;
  const args = lifecycleArgsSchema.safeParse(entry.args);
  const move = args.success ? findMove(type, String(row.state), args.data.to) : undefined;
  // A move the server will refuse leaves the row as it is (the refusal then shows in the sync list).
  if (!args.success || !move) return row;
  const effect = moveEffect(type, move, args.data, userId, new Date(entry.createdAt));
  const wire = Object.fromEntries(Object.entries(effect).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v]));
  return { ...row, ...wire, updatedAt: entry.createdAt, updatedBy: userId };
}
