import type { Executor } from "@/db";
import { insertMany } from "@/db/json-rows";
import { auditEntries } from "@/db/schema";

export type AuditInput = {
  projectId: string | null;
  userId: string | null;
  deviceId?: string | null;
  recordType: string;
  recordId?: string | null;
  action: string;
  before?: unknown;
  after?: unknown;
  note?: string;
};

/** Appends an audit entry. Call it inside the transaction of the change it records. */
export async function writeAudit(tx: Executor, entry: AuditInput): Promise<void> {
  await writeAudits(tx, [entry]);
}

/** Appends several audit entries in one statement (the sync push's set-based writes). */
export async function writeAudits(tx: Executor, entries: AuditInput[]): Promise<void> {
  if (entries.length === 1) await tx.insert(auditEntries).values(auditRow(entries[0]));
  else if (entries.length > 1) await insertMany(tx, auditEntries, entries.map(auditRow), { returning: false });
}

const auditRow = (entry: AuditInput) => ({
  projectId: entry.projectId,
  userId: entry.userId,
  deviceId: entry.deviceId ?? null,
  recordType: entry.recordType,
  recordId: entry.recordId ?? null,
  action: entry.action,
  before: entry.before ?? null,
  after: entry.after ?? null,
  note: entry.note ?? null,
});
