"use client";

import { useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { Finding } from "@/lib/checks";
import { truckNeedsReason } from "@/lib/placements/workflow";
import { createLocal, updateLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { DELIVERY_STATUS_WORDS } from "@/lib/ui/vocabulary";
import { unitSystemOf } from "./field-project";
import { formatDay } from "./project-time";
import { toSI, unitLabel } from "./unit-inputs";
import { writeErrorOf } from "./write-error";
import { NowInput } from "./now-input";
import { DeliveryChecks } from "./delivery-checks";
import { AcceptOrReject, NotClearedQuestion } from "./delivery-decisions";
import { changedFields, resolveTicketTimes, type TicketTimeName } from "./delivery-times";
import { DRAFT_ID, draftFindings, findingsFor } from "./findings-model";
import { FormFooter } from "./form-footer";
import { FIELD_OF, valuesOf, wholeOrNull, type Values } from "./delivery-form-values";
import type { FieldFindings } from "./use-findings";

export function DeliveryForm({
  placement,
  project,
  existing,
  checks,
  onDone,
}: {
  placement: LocalRecord<"placements">;
  project: ProjectRow;
  existing: LocalRecord<"deliveries"> | null;
  checks: FieldFindings | undefined;
  onDone: () => void;
}) {
  const db = useSyncDb();
  const units = unitSystemOf(project);
  const timeZone = project.timeZone;
  const [failure, setFailure] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, setValue, setFocus, formState } = useForm<Values>({ defaultValues: valuesOf(existing, units, timeZone) });
  useDirtyGuard(existing ? `delivery-${existing.id}` : "delivery-new", formState.isDirty);
  const errors = formState.errors;
  const v = useWatch({ control }) as Values;
  const times = resolveTicketTimes(v, timeZone, new Date(), v.batchDate || null);
  const batchedAt = times.at.batchedAt;
  const draft = {
    id: existing?.id ?? DRAFT_ID,
    placementId: placement.id,
    ticketNumber: v.ticketNumber.trim(),
    truck: v.truck.trim(),
    volumeM3: toSI("volume", v.volume, units) ?? 0,
    mixCode: v.mixCode.trim() || null,
    batchedAt,
    arrivedAt: times.at.arrivedAt ?? batchedAt,
    dischargeStartedAt: times.at.dischargeStartedAt,
    dischargeFinishedAt: times.at.dischargeFinishedAt,
    revolutions: wholeOrNull(v.revolutions),
    waterAddedL: toSI("waterVolume", v.water, units),
    waterFirstAt: times.at.waterFirstAt,
    waterLastAt: times.at.waterLastAt,
    status: v.status,
  };
  const live = checks && batchedAt ? draftFindings(checks.records, "deliveries", draft, new Date()) : [];
  // A new truck on work the inspector has not cleared needs a reason; a flagged load needs a decision.
  const needsReason = !existing && truckNeedsReason(placement.state);
  const [decision, setDecision] = useState<Finding[] | null>(null);

  const save = async (f: Values) => {
    setFailure(null);
    const at = resolveTicketTimes(f, timeZone, new Date(), f.batchDate || null).at;
    const values: Record<string, unknown> = {
      ticketNumber: f.ticketNumber.trim(),
      truck: f.truck.trim() || undefined,
      volumeM3: toSI("volume", f.volume, units) ?? undefined,
      mixCode: f.mixCode.trim() || null,
      batchedAt: at.batchedAt ?? undefined,
      arrivedAt: at.arrivedAt ?? undefined,
      dischargeStartedAt: at.dischargeStartedAt,
      dischargeFinishedAt: at.dischargeFinishedAt,
      revolutions: wholeOrNull(f.revolutions),
      waterAddedL: toSI("waterVolume", f.water, units),
      waterFirstAt: at.waterFirstAt,
      waterLastAt: at.waterLastAt,
      waterAddedBy: f.waterAddedBy.trim() || null,
      waterAuthorisedBy: f.waterAuthorisedBy.trim() || null,
      admixtureNote: f.admixtureNote.trim() || null,
      status: f.status,
      rejectReason: f.status === "rejected" ? f.rejectReason.trim() || null : null,
      ...(needsReason ? { notClearedReason: f.notClearedReason.trim() } : {}),
    };
    try {
      if (existing) {
        const patch = changedFields(existing, values);
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
  };

  const onSubmit = handleSubmit(async (f) => {
    if (needsReason && !f.notClearedReason.trim()) {
      setError("notClearedReason", { message: "Say why concrete is going onto this placement before it is cleared" });
      return;
    }
    // Warnings the stored truck did not have yet (an edit of an accepted late truck is not asked again).
    const known = new Set(existing ? findingsFor(checks?.findings ?? [], "delivery", existing.id).map((x) => x.rule) : []);
    const warnings = live.filter((x) => x.severity === "warning" && !known.has(x.rule));
    if (f.status === "accepted" && warnings.length > 0) {
      setDecision(warnings);
      return;
    }
    await save(f);
  });
  const acceptAnyway = handleSubmit(save);

  const time = (name: TicketTimeName, label: string) => {
    const date = times.dates[name];
    const nextDay = date && date !== times.date;
    return (
      <Controller
        control={control}
        name={name}
        render={({ field }) => (
          <NowInput
            label={label}
            value={String(field.value)}
            onChange={field.onChange}
            error={errors[name]?.message}
            testId={`delivery-${name}`}
            timeZone={timeZone}
            hint={
              date ? (
                <p className={nextDay ? "text-sm font-semibold text-ink-900" : "text-sm text-muted"} data-testid={`delivery-${name}-date`} data-date={date}>
                  {formatDay(date)}
                  {nextDay ? " · next day" : ""}
                </p>
              ) : null
            }
          />
        )}
      />
    );
  };

  return (
    <form onSubmit={onSubmit} className="mt-3 grid gap-3 rounded-lg border-2 border-lichen-600 p-3 sm:grid-cols-2" data-testid="delivery-form" noValidate>
      <Field label="Ticket number" inputMode="numeric" error={errors.ticketNumber?.message} data-testid="delivery-ticket" {...register("ticketNumber")} />
      <Field label="Truck" error={errors.truck?.message} data-testid="delivery-truck" {...register("truck")} />
      <Field label="Volume" inputMode="decimal" unit={unitLabel("volume", units)} error={errors.volume?.message} data-testid="delivery-volume" {...register("volume")} />
      <Field label="Mix on the ticket" hint="Checked against the placement's mix" error={errors.mixCode?.message} data-testid="delivery-mix-code" {...register("mixCode")} />
      <Controller
        control={control}
        name="batchDate"
        render={({ field }) => (
          <Field
            label="Batch date"
            type="date"
            hint="The date printed beside the batch time"
            data-testid="delivery-batch-date"
            name={field.name}
            value={field.value || times.date}
            onChange={(e) => field.onChange(e.target.value)}
            onBlur={field.onBlur}
          />
        )}
      />
      {time("batchedAt", "Batched")}
      {time("arrivedAt", "Arrived")}
      {time("dischargeStartedAt", "Discharge start")}
      {time("dischargeFinishedAt", "Discharge end")}
      {times.crossesMidnight ? (
        <Notice tone="info" title="This truck crossed midnight" className="sm:col-span-2" testId="delivery-midnight">
          A time earlier than the one before it is on the next day: batched {formatDay(times.dates.batchedAt ?? times.date)}, the times after midnight on{" "}
          {formatDay([...Object.values(times.dates)].sort().at(-1) ?? times.date)}. Change the batch date if that is wrong.
        </Notice>
      ) : null}
      <Field label="Drum revolutions" inputMode="numeric" hint="From the ticket or the drum counter" error={errors.revolutions?.message} data-testid="delivery-revolutions" {...register("revolutions")} />
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
      {v.status === "rejected" ? (
        <Field label="Why it was rejected" className="sm:col-span-2" error={errors.rejectReason?.message} data-testid="delivery-reject-reason" {...register("rejectReason")} />
      ) : null}
      {needsReason ? <NotClearedQuestion placement={placement} input={register("notClearedReason")} error={errors.notClearedReason?.message} /> : null}
      <div className="sm:col-span-2">
        <DeliveryChecks found={live} times={{ batchedAt, dischargeFinishedAt: draft.dischargeFinishedAt, status: v.status }} project={project} testId="delivery-live-checks" />
      </div>
      {decision ? (
        <AcceptOrReject
          findings={decision}
          onAccept={() => {
            setDecision(null);
            void acceptAnyway();
          }}
          onReject={() => {
            setDecision(null);
            setValue("status", "rejected", { shouldDirty: true });
            setTimeout(() => setFocus("rejectReason"), 0);
          }}
        />
      ) : null}
      <FormFooter failure={failure} saveLabel={existing ? "Save changes" : "Save truck"} saveTestId="delivery-save" submitting={formState.isSubmitting} onCancel={onDone} />
    </form>
  );
}
