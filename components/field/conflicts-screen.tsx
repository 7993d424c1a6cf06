"use client";

import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { CircleCheck, OctagonAlert } from "lucide-react";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { RECONCILE_WORDS } from "@/lib/ui/vocabulary";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { dismissRejection, getRecord, isLocalRecordType, listConflicts, localDef, resolveConflictLocal, type ConflictRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useProjects } from "./field-project";
import { formatDateTime } from "./project-time";
import { useDeviceWrite } from "./use-device-write";

const META = new Set(["id", "projectId", "version", "changeSeq", "deletedAt", "createdAt", "updatedAt", "createdBy", "updatedBy", "pending", "serverCopy"]);

/** The values the device tried to write: an update's patch, a create's fields, a resolve's patch. */
function deviceValues(conflict: ConflictRow): Record<string, unknown> {
  const payload = (conflict.clientPayload ?? {}) as { name?: string; args?: Record<string, unknown> };
  const args = payload.args ?? (conflict.clientPayload as Record<string, unknown>) ?? {};
  const values = (args.patch as Record<string, unknown> | undefined) ?? args;
  return Object.fromEntries(Object.entries(values).filter(([key]) => !META.has(key)));
}

function show(value: unknown): string {
  if (value === null || value === undefined || value === "") return "(empty)";
  if (typeof value === "string" && /^\d{4}-\d{2}-\d{2}T/.test(value)) return formatDateTime(value);
  if (typeof value === "object") return JSON.stringify(value);
  return String(value);
}

const label = (key: string) =>
  key
    .replace(/([A-Z])/g, " $1")
    .replace(/\b(Mm|M3|L|C|Pct|Kmh|Kg M3)\b/g, (u) => ({ Mm: "(mm)", M3: "(m³)", L: "(L)", C: "(°C)", Pct: "(%)", Kmh: "(km/h)", "Kg M3": "(kg/m³)" })[u] ?? u)
    .replace(/^./, (c) => c.toUpperCase());

function ConflictCard({ conflict }: { conflict: ConflictRow }) {
  const db = useSyncDb();
  const projects = useProjects();
  const record = useLiveQuery(
    async () => (isLocalRecordType(conflict.recordType) ? ((await getRecord(db, conflict.recordType, conflict.recordId)) ?? null) : null),
    [db, conflict.recordType, conflict.recordId],
  );
  const mine = deviceValues(conflict);
  const server = (conflict.serverPayload as Record<string, unknown> | null) ?? record?.serverCopy ?? record ?? {};
  const keys = Object.keys(mine).filter((key) => JSON.stringify(mine[key] ?? null) !== JSON.stringify(server[key] ?? null));
  const [choice, setChoice] = useState<Record<string, "mine" | "theirs">>({});
  const { error, run } = useDeviceWrite();
  const typeLabel = isLocalRecordType(conflict.recordType) ? localDef(conflict.recordType).label : conflict.recordType;
  const project = projects?.find((p) => p.id === conflict.projectId);
  const placementId = conflict.recordType === "placements" ? conflict.recordId : typeof server.placementId === "string" ? server.placementId : null;

  const resolve = (pick: "mine" | "theirs" | "chosen") =>
    run(async () => {
      const patch = Object.fromEntries(keys.filter((k) => (pick === "chosen" ? (choice[k] ?? "theirs") === "mine" : pick === "mine")).map((k) => [k, mine[k]]));
      await resolveConflictLocal(db, conflict.id, patch, conflict.serverVersion !== null ? { baseVersion: conflict.serverVersion } : {});
    });

  return (
    <li className="card p-4" data-testid="conflict" data-record-id={conflict.recordId}>
      <p className="flex flex-wrap items-center gap-2 text-lg font-bold">
        <VocabularyIcon name={RECONCILE_WORDS.icon} className="h-5 w-5 text-danger-700" />
        {typeLabel}
        {typeof server.ticketNumber === "string" ? ` · ticket ${server.ticketNumber}` : typeof server.element === "string" ? ` · ${server.element}` : ""}
      </p>
      <p className="text-sm text-muted">
        {project?.name ?? "Project"} · someone else changed it before your change arrived ({conflict.reason}).
        {placementId ? (
          <>
            {" "}
            <Link className="font-semibold text-lichen-800 underline" href={`/field/placement?id=${placementId}`} prefetch={false}>
              Open the placement
            </Link>
          </>
        ) : null}
      </p>
      <table className="mt-3 w-full border-collapse text-left text-base">
        <thead>
          <tr className="border-b border-ink-200 text-sm text-muted">
            <th className="py-1 pr-2 font-semibold">Field</th>
            <th className="py-1 pr-2 font-semibold">On the server</th>
            <th className="py-1 font-semibold">On this device</th>
          </tr>
        </thead>
        <tbody>
          {keys.map((key) => {
            const pick = choice[key] ?? "theirs";
            const cell = (side: "theirs" | "mine", value: unknown) => (
              <td className="py-1 pr-2 align-top">
                <button
                  type="button"
                  aria-pressed={pick === side}
                  data-testid={`conflict-${side}-${key}`}
                  onClick={() => setChoice((c) => ({ ...c, [key]: side }))}
                  className={clsx(
                    "flex min-h-touch w-full items-center gap-1 rounded-lg border px-2 text-left font-semibold",
                    pick === side ? "border-lichen-700 bg-lichen-50 text-lichen-900" : "border-ink-300 bg-white",
                  )}
                >
                  {pick === side ? <CircleCheck className="h-4 w-4 shrink-0" aria-hidden="true" /> : null}
                  <span className="break-all">{show(value)}</span>
                </button>
              </td>
            );
            return (
              <tr key={key} className="border-b border-ink-100" data-testid={`conflict-field-${key}`}>
                <th scope="row" className="py-1 pr-2 align-top text-sm font-semibold">
                  {label(key)}
                </th>
                {cell("theirs", server[key])}
                {cell("mine", mine[key])}
              </tr>
            );
          })}
        </tbody>
      </table>
      {error ? (
        <Notice tone="danger" title="Not resolved" className="mt-2">
          {error}
        </Notice>
      ) : null}
      <div className="mt-3 flex flex-wrap gap-2">
        <Button data-testid="keep-mine" onClick={() => void resolve("mine")}>
          Keep mine
        </Button>
        <Button variant="secondary" data-testid="keep-theirs" onClick={() => void resolve("theirs")}>
          Keep theirs
        </Button>
        {keys.length > 1 ? (
          <Button variant="secondary" data-testid="keep-chosen" onClick={() => void resolve("chosen")}>
            Keep the values chosen
          </Button>
        ) : null}
      </div>
    </li>
  );
}

export function ConflictsScreen() {
  const db = useSyncDb();
  const conflicts = useLiveQuery(() => listConflicts(db, "conflict"), [db]);
  const rejected = useLiveQuery(() => listConflicts(db, "rejected"), [db]);
  if (conflicts === undefined || rejected === undefined) return <p className="text-muted">Reading this device…</p>;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={RECONCILE_WORDS.label} subtitle="Changes made here and elsewhere to the same record" />
      {conflicts.length === 0 ? (
        <Notice tone="success" title="No conflicts to resolve." testId="no-conflicts" />
      ) : (
        <ul className="flex flex-col gap-3">
          {conflicts.map((c) => (
            <ConflictCard key={c.id} conflict={c} />
          ))}
        </ul>
      )}
      {rejected.length > 0 ? (
        <section aria-label="Refused changes" className="flex flex-col gap-2">
          <h2 className="text-xl font-bold">Changes the server refused</h2>
          {rejected.map((r) => (
            <div key={r.id} className="card flex flex-wrap items-start gap-3 p-4" data-testid="rejected-change">
              <OctagonAlert className="h-5 w-5 shrink-0 text-danger-700" aria-hidden="true" />
              <div className="min-w-0 flex-1">
                <p className="font-semibold">{isLocalRecordType(r.recordType) ? localDef(r.recordType).label : r.recordType}</p>
                <p className="text-sm">{r.message ?? r.reason}</p>
                <p className="text-sm text-muted">The server keeps what was sent; this device no longer shows it.</p>
              </div>
              <Button variant="secondary" onClick={() => void dismissRejection(db, r.id)}>
                Dismiss
              </Button>
            </div>
          ))}
        </section>
      ) : null}
    </div>
  );
}
