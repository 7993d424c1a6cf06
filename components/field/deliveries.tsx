"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { Pencil, Plus, Truck } from "lucide-react";
import { useState } from "react";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { StateBadge } from "@/components/ui/state-badge";
import { formatVolume, formatWaterVolume } from "@/lib/concrete";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { mayWrite, unitSystemOf } from "./field-project";
import { dateInZone, formatDay, formatTime } from "./project-time";
import { byTime } from "./record-fields";
import { Section } from "./section";
import { DeliveryChecks } from "./delivery-checks";
import { DeliveryForm } from "./delivery-form";
import { findingsFor } from "./findings-model";
import type { FieldFindings } from "./use-findings";

/** Trucks in the order they came: batch time, then arrival, then ticket number. */
export const deliveryOrder = (a: LocalRecord<"deliveries">, b: LocalRecord<"deliveries">) =>
  byTime("batchedAt")(a, b) || byTime("arrivedAt")(a, b) || a.ticketNumber.localeCompare(b.ticketNumber, undefined, { numeric: true });

export function Deliveries({ placement, project, checks }: { placement: LocalRecord<"placements">; project: ProjectRow; checks: FieldFindings | undefined }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const deliveries = useLiveQuery(async () => (await listByParent(db, "deliveries", "placementId", placement.id)).sort(deliveryOrder), [db, placement.id]);
  const [editing, setEditing] = useState<string | null>(null);
  const canWrite = mayWrite(project, "delivery.write");
  // Each time with its date when the truck's times span midnight, so 00:50 never reads as before 23:05.
  const dayOf = (value: unknown) => (typeof value === "string" && value ? dateInZone(new Date(value), project.timeZone) : "");
  const whenOf = (d: LocalRecord<"deliveries">) => (value: unknown) => {
    const spans = new Set([d.batchedAt, d.arrivedAt, d.dischargeStartedAt, d.dischargeFinishedAt].map(dayOf).filter(Boolean)).size > 1;
    return spans ? `${formatDay(dayOf(value))} ${formatTime(value, project.timeZone)}` : formatTime(value, project.timeZone);
  };
  const total = (deliveries ?? []).filter((d) => d.status !== "rejected").reduce((sum, d) => sum + (d.volumeM3 ?? 0), 0);

  return (
    <Section
      title="Deliveries"
      testId="deliveries"
      actions={
        editing !== "new" && canWrite ? (
          <Button data-testid="add-delivery" onClick={() => setEditing("new")}>
            <Plus className="h-5 w-5" aria-hidden="true" /> Add a truck
          </Button>
        ) : null
      }
    >
      <p className="text-sm text-muted" data-testid="delivery-total">
        {(deliveries ?? []).length} {(deliveries ?? []).length === 1 ? "truck" : "trucks"} · {formatVolume(total, units)} accepted
      </p>
      {editing === "new" ? <DeliveryForm placement={placement} project={project} checks={checks} existing={null} onDone={() => setEditing(null)} /> : null}
      <ul className="mt-3 flex flex-col gap-3">
        {(deliveries ?? []).map((d, i) => {
          const found = findingsFor(checks?.findings ?? [], "delivery", d.id);
          const when = whenOf(d);
          return (
            <li key={d.id} className="rounded-lg border border-ink-200 p-3" data-testid="delivery-row" data-ticket={d.ticketNumber}>
              <div className="flex flex-wrap items-center gap-2">
                <Truck className="h-5 w-5 text-ink-600" aria-hidden="true" />
                <span className="text-lg font-bold">
                  #{i + 1} · Ticket <span data-testid="delivery-ticket-number">{d.ticketNumber}</span>
                </span>
                {d.truck ? <span className="text-muted">truck {d.truck}</span> : null}
                {d.mixCode ? <span className="text-muted" data-testid="delivery-mix">mix {d.mixCode}</span> : null}
                <span className="text-muted" data-testid="delivery-batch-day">
                  {formatDay(dayOf(d.batchedAt))}
                </span>
                {d.status === "rejected" ? <StateBadge kind="delivery" code="rejected" testId="delivery-rejected" /> : null}
                {canWrite ? (
                <Button variant="ghost" className="ml-auto" data-testid="edit-delivery" onClick={() => setEditing(d.id)} aria-label={`Edit ticket ${d.ticketNumber}`}>
                  <Pencil className="h-4 w-4" aria-hidden="true" /> Edit
                </Button>
                ) : null}
              </div>
              <p className="mt-1 text-base">
                {typeof d.volumeM3 === "number" ? formatVolume(d.volumeM3, units) : "—"} · batched {when(d.batchedAt)} · arrived {when(d.arrivedAt)}
                {d.dischargeFinishedAt ? ` · discharged by ${when(d.dischargeFinishedAt)}` : ""}
                {typeof d.revolutions === "number" ? ` · ${d.revolutions} revolutions` : ""}
              </p>
              {d.waterAddedL ? (
                <p className="text-sm">
                  Water added {formatWaterVolume(d.waterAddedL, units)}
                  {d.waterAddedBy ? ` by ${d.waterAddedBy}` : ""}
                  {d.waterAuthorisedBy ? `, authorised by ${d.waterAuthorisedBy}` : ", authorisation not recorded"}
                </p>
              ) : null}
              {d.admixtureNote ? <p className="text-sm">Admixture: {d.admixtureNote}</p> : null}
              <div className="mt-2">
                <DeliveryChecks found={found} times={{ batchedAt: d.batchedAt || null, dischargeFinishedAt: (d.dischargeFinishedAt ?? "") || null, status: d.status }} project={project} />
              </div>
              <RecordPhotos projectId={project.id} recordType="deliveries" recordId={d.id} canAdd={canAddPhotos(project, placement)} title="Truck photos" />
              {editing === d.id ? <DeliveryForm placement={placement} project={project} checks={checks} existing={d} onDone={() => setEditing(null)} /> : null}
            </li>
          );
        })}
      </ul>
    </Section>
  );
}
