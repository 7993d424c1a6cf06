// Sync state in words for the status control and its sheet (never colour alone).
import type { ConflictRow, OutboxEntry } from "./db";
import { isLocalRecordType, localDef } from "./record-types";

const ACTIONS: Record<OutboxEntry["name"], string> = {
  create: "new",
  update: "changed",
  delete: "deleted",
  transition: "state change",
  resolve: "conflict resolved",
};

function labelOf(type: string): string {
  return isLocalRecordType(type) ? localDef(type).label : type;
}

/** "Delivery (new)", "Placement (state change → ready)". */
export function describeEntry(entry: Pick<OutboxEntry, "name" | "recordType" | "args">): string {
  const action = ACTIONS[entry.name];
  const to = entry.name === "transition" && typeof entry.args.to === "string" ? ` → ${entry.args.to}` : "";
  return `${labelOf(entry.recordType)} (${action}${to})`;
}

export function describeConflict(row: Pick<ConflictRow, "recordType" | "reason" | "message" | "kind">): string {
  if (row.message) return row.message;
  const label = labelOf(row.recordType);
  if (row.kind === "rejected") {
    if (row.reason === "signed") return `${label}: the placement was signed before this change arrived.`;
    if (row.reason === "forbidden") return `${label}: your role on the project does not allow this change.`;
    if (row.reason === "not_found") return `${label}: the record no longer exists on the server.`;
    return `${label}: the server refused this change (${row.reason}).`;
  }
  return `${label}: changed on another device too. Choose which value to keep.`;
}

/** "just now", "5 min ago", "3 h ago", "2 days ago". */
export function describeSince(iso: string | null | undefined, now: number): string {
  if (!iso) return "never";
  const ms = now - Date.parse(iso);
  if (!Number.isFinite(ms)) return "unknown";
  const min = Math.floor(ms / 60_000);
  if (min < 1) return "just now";
  if (min < 60) return `${min} min ago`;
  const h = Math.floor(min / 60);
  if (h < 24) return `${h} h ago`;
  const d = Math.floor(h / 24);
  return `${d} day${d === 1 ? "" : "s"} ago`;
}

export function plural(n: number, one: string, many: string = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** The sign-out warning when changes have not reached the server. */
export function unsyncedWarning(count: number): string {
  if (count === 1) return "1 change has not reached the server yet. It stays on this device and will be sent the next time you sign in.";
  return `${count} changes have not reached the server yet. They stay on this device and will be sent the next time you sign in.`;
}
