"use client";

// The one audit trail of a record: every accepted change, oldest first (who, when, from which
// device, before → after), read from the server when opened, so it needs a connection and says so
// offline. `panel` is the collapsible card of the field screens; `inline` the small link-like
// toggle beside a row of the office review. Entry shape and changed fields: audit-model.ts.
import { useQuery } from "@tanstack/react-query";
import { History, WifiOff } from "lucide-react";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { useOnline } from "@/lib/sync/client/react";
import { formatInstant } from "@/lib/time/zone";
import { auditPath, auditQueryKey, changedFields, changeSummary, showValue, type AuditEntry } from "./audit-model";

type Trail = { projectId: string; recordId: string; timeZone: string };

function useAuditEntries({ projectId, recordId }: Trail, enabled: boolean) {
  return useQuery({
    queryKey: auditQueryKey(projectId, recordId),
    enabled,
    staleTime: 0,
    queryFn: async () => {
      const res = await callApi<AuditEntry[]>(auditPath(projectId, recordId));
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
  });
}

function PanelEntries(trail: Trail) {
  const online = useOnline();
  const entries = useAuditEntries(trail, online);
  if (!online) {
    return (
      <Notice tone="info" title="No connection" testId="audit-offline">
        <span className="inline-flex items-center gap-1">
          <WifiOff className="h-4 w-4" aria-hidden="true" /> The audit trail is read from the server; it shows when you are online.
        </span>
      </Notice>
    );
  }
  if (entries.isPending) return <p className="text-muted">Reading the audit trail…</p>;
  if (entries.isError) return <Notice tone="danger" title="Could not read the audit trail">{entries.error.message}</Notice>;
  if (entries.data.length === 0) return <p className="text-muted">No accepted changes yet (changes still on this device are not in it).</p>;
  return (
    <ol className="flex flex-col divide-y divide-ink-100" data-testid="audit-entries">
      {entries.data.map((e) => {
        const changes = e.action === "create" ? [] : changedFields(e.before, e.after);
        return (
          <li key={e.id} className="py-2" data-testid="audit-entry" data-action={e.action}>
            <p className="flex flex-wrap items-baseline gap-x-2 text-base">
              <span className="font-semibold">{e.action}</span>
              <span>{e.userName ?? "system"}</span>
              <span className="text-sm text-muted">{formatInstant(e.at, trail.timeZone, "weekdayDayTime")}</span>
              <span className="text-sm text-muted">{e.deviceId ? `device ${e.deviceId.slice(0, 8)}` : "from the web"}</span>
            </p>
            {e.note ? <p className="text-sm text-ink-800">{e.note}</p> : null}
            {changes.length ? (
              <ul className="mt-1 text-sm">
                {changes.map((c) => (
                  <li key={c.key} className="break-words">
                    <span className="font-mono text-ink-700">{c.key}</span>: <span className="text-ink-700 line-through decoration-ink-400">{showValue(c.before)}</span> →{" "}
                    <span className="font-semibold text-ink-950">{showValue(c.after)}</span>
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

function InlineTrail({ label, defaultOpen, ...trail }: Trail & { label: string; defaultOpen: boolean }) {
  const [open, setOpen] = useState(defaultOpen);
  const entries = useAuditEntries(trail, open);
  return (
    <div data-testid={`audit-${trail.recordId}`}>
      <button type="button" className="text-xs font-semibold text-lichen-800 underline-offset-2 hover:underline" onClick={() => setOpen(!open)} aria-expanded={open}>
        {open ? `Hide ${label.toLowerCase()}` : label}
      </button>
      {open ? (
        entries.isPending ? (
          <p className="text-xs text-muted">Loading…</p>
        ) : entries.isError ? (
          <p className="text-xs text-danger-700">{entries.error.message}</p>
        ) : (
          <ol className="mt-1 space-y-0.5 text-xs">
            {entries.data.map((e) => (
              <li key={e.id} className="flex gap-2">
                <span className="shrink-0 tabular-nums text-muted">{formatInstant(e.at, trail.timeZone, "dayTime")}</span>
                <span className="shrink-0 font-semibold">{e.userName ?? "System"}</span>
                <span className="shrink-0">{e.action}</span>
                <span className="min-w-0 break-words text-ink-700">{changeSummary(e)}{e.note ? ` (${e.note})` : ""}</span>
              </li>
            ))}
          </ol>
        )
      ) : null}
    </div>
  );
}

export function AuditTrail({
  look = "panel",
  label,
  defaultOpen = false,
  ...trail
}: Trail & { look?: "panel" | "inline"; label?: string; defaultOpen?: boolean }) {
  const [open, setOpen] = useState(defaultOpen);
  if (look === "inline") return <InlineTrail {...trail} label={label ?? "History"} defaultOpen={defaultOpen} />;
  return (
    <details className="card no-print p-4" data-testid="audit-trail" open={defaultOpen || undefined} onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)}>
      <summary className="flex min-h-touch cursor-pointer items-center gap-2 text-xl font-bold text-ink-950">
        <History className="h-5 w-5" aria-hidden="true" /> {label ?? "Audit trail"}
      </summary>
      <div className="mt-2">{open ? <PanelEntries {...trail} /> : null}</div>
    </details>
  );
}
