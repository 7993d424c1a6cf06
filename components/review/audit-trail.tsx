"use client";

// A record's audit trail, read from GET /api/projects/{projectId}/audit/{recordId} when opened.
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { callApi } from "@/lib/api/client";

type Entry = { id: number; at: string; action: string; recordType: string; deviceId: string | null; userName: string | null; before: Record<string, unknown> | null; after: Record<string, unknown> | null; note: string | null };

const SKIP = new Set(["version", "changeSeq", "updatedAt", "updatedBy", "createdAt"]);

function changes(e: Entry): string {
  if (!e.before || !e.after) return e.action === "create" ? "Created" : e.action;
  const keys = Object.keys(e.after).filter((k) => !SKIP.has(k) && JSON.stringify(e.before![k]) !== JSON.stringify(e.after![k]));
  if (!keys.length) return e.action;
  return keys.map((k) => `${k}: ${JSON.stringify(e.before![k])} → ${JSON.stringify(e.after![k])}`).join("; ");
}

export function AuditTrail({ projectId, recordId, timeZone, label = "History", defaultOpen = false }: { projectId: string; recordId: string; timeZone: string; label?: string; defaultOpen?: boolean }) {
  const [open, setOpen] = useState(defaultOpen);
  const query = useQuery({
    queryKey: ["audit", projectId, recordId],
    enabled: open,
    queryFn: async () => {
      const res = await callApi<Entry[]>(`/api/projects/${projectId}/audit/${recordId}`);
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
  });
  const when = new Intl.DateTimeFormat("en-US", { timeZone, month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
  return (
    <div data-testid={`audit-${recordId}`}>
      <button type="button" className="text-xs font-semibold text-lichen-800 underline-offset-2 hover:underline" onClick={() => setOpen(!open)} aria-expanded={open}>
        {open ? `Hide ${label.toLowerCase()}` : label}
      </button>
      {open ? (
        query.isPending ? (
          <p className="text-xs text-muted">Loading…</p>
        ) : query.isError ? (
          <p className="text-xs text-danger-700">{query.error.message}</p>
        ) : (
          <ol className="mt-1 space-y-0.5 text-xs">
            {query.data.map((e) => (
              <li key={e.id} className="flex gap-2">
                <span className="shrink-0 tabular-nums text-muted">{when.format(new Date(e.at))}</span>
                <span className="shrink-0 font-semibold">{e.userName ?? "System"}</span>
                <span className="shrink-0">{e.action}</span>
                <span className="min-w-0 break-words text-ink-700">{changes(e)}{e.note ? ` (${e.note})` : ""}</span>
              </li>
            ))}
          </ol>
        )
      ) : null}
    </div>
  );
}
