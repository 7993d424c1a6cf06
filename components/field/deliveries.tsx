"use client";

import { StateBadge } from "@/components/ui/state-badge";
import { DELIVERY_STATUS_WORDS } from "@/lib/ui/vocabulary";
import { FormFooter } from "./form-footer";
import { useLiveQuery } from "dexie-react-hooks";
import { Pencil, Plus, Truck } from "lucide-react";
import { useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { formatVolume, formatWaterVolume, type UnitSystem } from "@/lib/concrete";
import { createLocal, listByParent, updateLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import {
  NowInput,
  mayWrite,
  Section,
  byTime,
  formatTime,
  fromSI,
  fromTimeInput,
  num,
  str,
  toSI,
  toLocalInput,
  toTimeInput,
  todayLocal,
  unitLabel,
  unitSystemOf,
  writeErrorOf,
} from "./common";
import { DeliveryChecks } from "./delivery-checks";
import { draftFindings, findingsFor, DRAFT_ID } from "./findings-model";
import type { FieldFindings } from "./use-findings";

/** Trucks in the order they came: batch time, then arrival, then ticket number. */
export const deliveryOrder = (a: LocalRecord, b: LocalRecord) =>
  byTime("batchedAt")(a, b) || byTime("arrivedAt")(a, b) || str(a.ticketNumber).localeCompare(str(b.ticketNumber), undefined, { numeric: true });

type Values = {
  ticketNumber: string;
  truck: string;
  volume: string;
  batchedAt: string;
  arrivedAt: string;
  dischargeStartedAt: string;
  dischargeFinishedAt: string;
  water: string;
  waterFirstAt: string;
  waterLastAt: string;
  waterAddedBy: string;
  waterAuthorisedBy: string;
  admixtureNote: string;
  status: "accepted" | "rejected";
  rejectReason: string;
};

const FIELD_OF: Record<string, keyof Values> = { volumeM3: "volume", waterAddedL: "water" };

function valuesOf(d: LocalRecord | null, units: UnitSystem): Values {
  return {
    ticketNumber: str(d?.ticketNumber),
    truck: str(d?.truck),
    volume: d ? fromSI("volume", d.volumeM3, units) : "",
    batchedAt: d ? toTimeInput(str(d.batchedAt)) : "",
    arrivedAt: d ? toTimeInput(str(d.arrivedAt)) : toTimeInput(new Date()),
    dischargeStartedAt: toTimeInput(str(d?.dischargeStartedAt)),
    dischargeFinishedAt: toTimeInput(str(d?.dischargeFinishedAt)),
    water: d ? fromSI("waterVolume", d.waterAddedL, units, 1) : "",
    waterFirstAt: toTimeInput(str(d?.waterFirstAt)),
    waterLastAt: toTimeInput(str(d?.waterLastAt)),
    waterAddedBy: str(d?.waterAddedBy),
    waterAuthorisedBy: str(d?.waterAuthorisedBy),
    admixtureNote: str(d?.admixtureNote),
    status: d?.status === "rejected" ? "rejected" : "accepted",
    rejectReason: str(d?.rejectReason),
  };
}

function DeliveryForm({
  placement,
  project,
  existing,
  checks,
  onDone,
}: {
  placement: LocalRecord;
  project: ProjectRow;
  existing: LocalRecord | null;
  checks: FieldFindings | undefined;
  onDone: () => void;
}) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  // Times are typed as clock times on the day of the load (the batch day when editing).
  const baseDate = (existing ? toLocalInput(str(existing.batchedAt)).slice(0, 10) : "") || todayLocal();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, formState } = useForm<Values>({ defaultValues: valuesOf(existing, units) });
  useDirtyGuard(existing ? `delivery-${existing.id}` : "delivery-new", formState.isDirty);
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const at = (t: string) => fromTimeInput(t, baseDate);
  const batchedAt = at(v.batchedAt);
  const draft = {
    id: existing?.id ?? DRAFT_ID,
    placementId: placement.id,
    ticketNumber: v.ticketNumber.trim(),
    truck: v.truck.trim(),
    volumeM3: toSI("volume", v.volume, units) ?? 0,
    batchedAt,
    arrivedAt: at(v.arrivedAt) ?? batchedAt,
    dischargeStartedAt: at(v.dischargeStartedAt),
    dischargeFinishedAt: at(v.dischargeFinishedAt),
    waterAddedL: toSI("waterVolume", v.water, units),
    waterFirstAt: at(v.waterFirstAt),
    waterLastAt: at(v.waterLastAt),
    status: v.status,
  };
  const live = checks && batchedAt ? draftFindings(checks.records, "deliveries", draft, new Date()) : [];

  const onSubmit = handleSubmit(async (f) => {
    setFailure(null);
    const values: Record<string, unknown> = {
      ticketNumber: f.ticketNumber.trim(),
      truck: f.truck.trim() || undefined,
      volumeM3: toSI("volume", f.volume, units) ?? undefined,
      batchedAt: at(f.batchedAt) ?? undefined,
      arrivedAt: at(f.arrivedAt) ?? undefined,
      dischargeStartedAt: at(f.dischargeStartedAt),
      dischargeFinishedAt: at(f.dischargeFinishedAt),
      waterAddedL: toSI("waterVolume", f.water, units),
      waterFirstAt: at(f.waterFirstAt),
      waterLastAt: at(f.waterLastAt),
      waterAddedBy: f.waterAddedBy.trim() || null,
      waterAuthorisedBy: f.waterAuthorisedBy.trim() || null,
      admixtureNote: f.admixtureNote.trim() || null,
      status: f.status,
      rejectReason: f.status === "rejected" ? f.rejectReason.trim() || null : null,
    };
    try {
      if (existing) {
        // Only what changed, so a field edited elsewhere meanwhile is not overwritten.
        const patch = Object.fromEntries(
          Object.entries(values).filter(([key, value]) => {
            const before = existing[key] ?? null;
            const after = value ?? null;
            if (typeof before === "string" && typeof after === "string" && !Number.isNaN(Date.parse(before)) && /T/.test(before)) {
              return Date.parse(before) !== Date.parse(after);
            }
            if (typeof before === "number" && typeof after === "number") return Math.abs(before - after) > 1e-6;
            return before !== after && !(before === "" && after === null);
          }),
        );
        if (Object.keys(patch).length > 0) await updateLocal(db, "deliveries", existing.id, patch);
      } else {
        await createLocal(db, "deliveries", placement.projectId, { placementId: placement.id, ...values });
      }
      onDone();
    } catch (error) {
      const { message, fields } = writeErrorOf(error);
      for (const [key, text] of Object.entries(fields)) setError(FIELD_OF[key] ?? (key as keyof Values), { message: text });
      setFailure(message);
    }
  });

  const time = (name: keyof Values, label: string) => (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <NowInput label={label} value={String(field.value)} onChange={field.onChange} error={errors[name]?.message} testId={`delivery-${name}`} />
      )}
    />
  );

  return (
    <form onSubmit={onSubmit} className="mt-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="delivery-form" noValidate>
      <Field label="Ticket number" inputMode="numeric" error={errors.ticketNumber?.message} data-testid="delivery-ticket" {...register("ticketNumber")} />
      <Field label="Truck" error={errors.truck?.message} data-testid="delivery-truck" {...register("truck")} />
      <Field label="Volume" inputMode="decimal" unit={unitLabel("volume", units)} error={errors.volume?.message} data-testid="delivery-volume" {...register("volume")} />
      {time("batchedAt", "Batched")}
      {time("arrivedAt", "Arrived")}
      {time("dischargeStartedAt", "Discharge start")}
      {time("dischargeFinishedAt", "Discharge end")}
      <Field label="Water added at site" inputMode="decimal" unit={unitLabel("waterVolume", units)} error={errors.water?.message} data-testid="delivery-water" {...register("water")} />
      {v.water && Number(v.water) > 0 ? (
        <>
          {time("waterFirstAt", "First water")}
          {time("waterLastAt", "Last water")}
          <Field label="Water added by" error={errors.waterAddedBy?.message} data-testid="delivery-water-by" {...register("waterAddedBy")} />
          <Field label="Water authorised by" error={errors.waterAuthorisedBy?.message} data-testid="delivery-water-authorised" {...register("waterAuthorisedBy")} />
        </>
      ) : null}
      <Field label="Admixture added at site" placeholder="product and amount" className="sm:col-span-2" {...register("admixtureNote")} />
      <fieldset className="sm:col-span-2">
        <legend className="text-sm font-semibold text-ink-800">Load</legend>
        <div className="mt-1 grid grid-cols-2 gap-2">
          {(["accepted", "rejected"] as const).map((s) => (
            <label key={s} className="flex min-h-touch items-center gap-2 rounded-lg border border-ink-300 px-3 font-semibold has-[:checked]:border-lichen-700 has-[:checked]:bg-lichen-50">
              <input type="radio" value={s} className="h-5 w-5" data-testid={`delivery-status-${s}`} {...register("status")} />
              {DELIVERY_STATUS_WORDS[s].label}
            </label>
          ))}
        </div>
      </fieldset>
      {v.status === "rejected" ? <Field label="Why it was rejected" className="sm:col-span-2" error={errors.rejectReason?.message} {...register("rejectReason")} /> : null}
      <div className="sm:col-span-2">
        <DeliveryChecks found={live} times={{ batchedAt, dischargeFinishedAt: draft.dischargeFinishedAt, status: v.status }} project={project} testId="delivery-live-checks" />
      </div>
      <FormFooter failure={failure} saveLabel={existing ? "Save changes" : "Save truck"} saveTestId="delivery-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}

export function Deliveries({ placement, project, checks }: { placement: LocalRecord; project: ProjectRow; checks: FieldFindings | undefined }) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const deliveries = useLiveQuery(async () => (await listByParent(db, "deliveries", "placementId", placement.id)).sort(deliveryOrder), [db, placement.id]);
  const [editing, setEditing] = useState<string | null>(null);
  const canWrite = mayWrite(project, "delivery.write");
  const total = (deliveries ?? []).filter((d) => d.status !== "rejected").reduce((sum, d) => sum + (num(d.volumeM3) ?? 0), 0);

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
          return (
            <li key={d.id} className="rounded-lg border border-ink-200 p-3" data-testid="delivery-row" data-ticket={str(d.ticketNumber)}>
              <div className="flex flex-wrap items-center gap-2">
                <Truck className="h-5 w-5 text-ink-600" aria-hidden="true" />
                <span className="text-lg font-bold">
                  #{i + 1} · Ticket <span data-testid="delivery-ticket-number">{str(d.ticketNumber)}</span>
                </span>
                {d.truck ? <span className="text-muted">truck {str(d.truck)}</span> : null}
                {d.status === "rejected" ? <StateBadge kind="delivery" code="rejected" testId="delivery-rejected" /> : null}
                {canWrite ? (
                <Button variant="ghost" className="ml-auto" data-testid="edit-delivery" onClick={() => setEditing(d.id)} aria-label={`Edit ticket ${str(d.ticketNumber)}`}>
                  <Pencil className="h-4 w-4" aria-hidden="true" /> Edit
                </Button>
                ) : null}
              </div>
              <p className="mt-1 text-base">
                {num(d.volumeM3) !== undefined ? formatVolume(num(d.volumeM3)!, units) : "—"} · batched {formatTime(d.batchedAt, project.timeZone)} · arrived {formatTime(d.arrivedAt, project.timeZone)}
                {d.dischargeFinishedAt ? ` · discharged by ${formatTime(d.dischargeFinishedAt, project.timeZone)}` : ""}
              </p>
              {num(d.waterAddedL) ? (
                <p className="text-sm">
                  Water added {formatWaterVolume(num(d.waterAddedL)!, units)}
                  {d.waterAddedBy ? ` by ${str(d.waterAddedBy)}` : ""}
                  {d.waterAuthorisedBy ? `, authorised by ${str(d.waterAuthorisedBy)}` : ", authorisation not recorded"}
                </p>
              ) : null}
              {d.admixtureNote ? <p className="text-sm">Admixture: {str(d.admixtureNote)}</p> : null}
              <div className="mt-2">
                <DeliveryChecks found={found} times={{ batchedAt: str(d.batchedAt) || null, dischargeFinishedAt: str(d.dischargeFinishedAt) || null, status: str(d.status) }} project={project} />
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
