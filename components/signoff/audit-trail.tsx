"use client";

// Every accepted change of one record, oldest first: who, when, from which device, before → after.
// Readable by every member of the project (the audit route checks); read from the server, so it
// needs a connection and says so offline.
import { useQuery } from "@tanstack/react-query";
import { History, WifiOff } from "lucide-react";
import { useState } from "react";
import { formatDateTime } from "@/components/field/common";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { useOnline } from "@/lib/sync/client/react";

type AuditEntry = {
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

function show(value: unknown): string {
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

function Entries({ projectId, recordId, timeZone }: { projectId: string; recordId: string; timeZone: string }) {
  const online = useOnline();
  const trail = useQuery({
    queryKey: ["audit", projectId, recordId],
    enabled: online,
    staleTime: 0,
    queryFn: async () => {
      const res = await callApi<AuditEntry[]>(`/api/projects/${projectId}/audit/${recordId}`);
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
  });
  if (!online) {
    return (
      <Notice tone="info" title="No connection" testId="audit-offline">
        <span className="inline-flex items-center gap-1">
          <WifiOff className="h-4 w-4" aria-hidden="true" /> The audit trail is read from the server; it shows when you are online.
        </span>
      </Notice>
    );
  }
  if (trail.isPending) return <p className="text-muted">Reading the audit trail…</p>;
  if (trail.isError) return <Notice tone="danger" title="Could not read the audit trail">{trail.error.message}</Notice>;
  if (trail.data.length === 0) return <p className="text-muted">No accepted changes yet (changes still on this device are not in it).</p>;
  return (
    <ol className="flex flex-col divide-y divide-ink-100" data-testid="audit-entries">
      {trail.data.map((e) => {
        const changes = e.action === "create" ? [] : changedFields(e.before, e.after);
        return (
          <li key={e.id} className="py-2" data-testid="audit-entry" data-action={e.action}>
            <p className="flex flex-wrap items-baseline gap-x-2 text-base">
              <span className="font-semibold">{e.action}</span>
              <span>{e.userName ?? "system"}</span>
              <span className="text-sm text-muted">{formatDateTime(e.at, timeZone)}</span>
              <span className="text-sm text-muted">{e.deviceId ? `device ${e.deviceId.slice(0, 8)}` : "from the web"}</span>
            </p>
            {e.note ? <p className="text-sm text-ink-800">{e.note}</p> : null}
            {changes.length ? (
              <ul className="mt-1 text-sm">
                {changes.map((c) => (
                  <li key={c.key} className="break-words">
                    <span className="font-mono text-ink-700">{c.key}</span>: <span className="text-ink-700 line-through decoration-ink-400">{show(c.before)}</span> →{" "}
                    <span className="font-semibold text-ink-950">{show(c.after)}</span>
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}

/** A collapsed panel; the trail is read when it is opened. */
export function AuditTrail({ projectId, recordId, timeZone, title = "Audit trail" }: { projectId: string; recordId: string; timeZone: string; title?: string }) {
  const [open, setOpen] = useState(false);
  return (
    <details className="card no-print p-4" data-testid="audit-trail" onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)}>
      <summary className="flex min-h-touch cursor-pointer items-center gap-2 text-xl font-bold text-ink-950">
        <History className="h-5 w-5" aria-hidden="true" /> {title}
      </summary>
      <div className="mt-2">{open ? <Entries projectId={projectId} recordId={recordId} timeZone={timeZone} /> : null}</div>
    </details>
  );
}
