// A record's audit trail as the screens read it (GET /api/projects/{projectId}/audit/{recordId}):
// the entry shape, the fields an entry changed, and how a value is shown. Pure, no React.

export type AuditEntry = {
  id: number;
  at: string;
  action: string;
  recordType: string;
  deviceId: string | null;
  userName: string | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  note: string | null;
};

// Bookkeeping that changes with every write; the change itself is in the other fields.
const SKIP = new Set(["version", "changeSeq", "updatedAt", "updatedBy", "createdAt", "projectId", "id", "signatureImage"]);

export function showValue(value: unknown): string {
  if (value === null || value === undefined || value === "") return "(empty)";
  if (typeof value === "object") return JSON.stringify(value);
  return String(value);
}

export function changedFields(before: Record<string, unknown> | null, after: Record<string, unknown> | null): { key: string; before: unknown; after: unknown }[] {
  const keys = new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})]);
  return [...keys]
    .filter((k) => !SKIP.has(k) && JSON.stringify(before?.[k] ?? null) !== JSON.stringify(after?.[k] ?? null))
    .map((k) => ({ key: k, before: before?.[k], after: after?.[k] }));
}

/** One line for a compact list: "Created", or each changed field as before → after. */
export function changeSummary(e: AuditEntry): string {
  if (!e.before || !e.after) return e.action === "create" ? "Created" : e.action;
  const changes = changedFields(e.before, e.after);
  if (!changes.length) return e.action;
  return changes.map((c) => `${c.key}: ${showValue(c.before)} → ${showValue(c.after)}`).join("; ");
}

export const auditQueryKey = (projectId: string, recordId: string) => ["audit", projectId, recordId] as const;
export const auditPath = (projectId: string, recordId: string) => `/api/projects/${projectId}/audit/${recordId}`;
