"use client";

// The visit report's fields: a form while the inspector's draft is open, plain text once it is
// submitted or signed (a disabled input cuts a long value off inside its box; text wraps in full).
// Times are read and written on the project's clock (visit-model.ts), not the device's.
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatDay } from "@/components/field/project-time";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { updateLocal, type LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { REPORT_FIELDS, reportPatch, reportValues, type ReportValues } from "./visit-model";

export function ReportView({ visit, timeZone }: { visit: LocalRecord<"site-visits">; timeZone: string }) {
  const v = reportValues(visit, timeZone);
  const onSite = v.arrived || v.left ? `${v.arrived || "—"} to ${v.left || "—"}` : "—";
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-base" data-testid="visit-report-text">
      <dt className="text-sm text-muted">Visit date</dt>
      <dd className="font-semibold">{v.visitDate ? formatDay(v.visitDate) : "—"}</dd>
      <dt className="text-sm text-muted">On site</dt>
      <dd className="font-semibold">{onSite}</dd>
      {REPORT_FIELDS.map(([k, label]) => (
        <div key={k} className="contents">
          <dt className="text-sm text-muted">{label}</dt>
          <dd className="min-w-0 whitespace-pre-wrap break-words" data-testid={`visit-text-${k}`}>
            {v[k] || "—"}
          </dd>
        </div>
      ))}
    </dl>
  );
}

export function ReportForm({ visit, timeZone }: { visit: LocalRecord<"site-visits">; timeZone: string }) {
  const db = useSyncDb();
  const [values, setValues] = useState<ReportValues>(() => reportValues(visit, timeZone));
  const { error, run } = useDeviceWrite();
  const [saved, setSaved] = useState(false);
  const set = (k: keyof ReportValues) => (e: React.ChangeEvent<HTMLInputElement>) => {
    setSaved(false);
    setValues((v) => ({ ...v, [k]: e.target.value }));
  };
  const save = () =>
    run(async () => {
      await updateLocal(db, "site-visits", visit.id, reportPatch(values, timeZone));
      setSaved(true);
    });
  return (
    <form
      className="grid gap-3 md:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <Field label="Visit date" type="date" value={values.visitDate} onChange={set("visitDate")} data-testid="visit-date" />
      <div className="grid grid-cols-2 gap-2">
        <Field label="On site from" type="time" value={values.arrived} onChange={set("arrived")} data-testid="visit-arrived" />
        <Field label="to" type="time" value={values.left} onChange={set("left")} data-testid="visit-left" />
      </div>
      {REPORT_FIELDS.map(([k, label]) => (
        <Field key={k} label={label} value={values[k]} onChange={set(k)} data-testid={`visit-${k}`} />
      ))}
      <div className="flex items-center gap-2 md:col-span-2">
        <Button type="submit" data-testid="visit-save">
          Save report
        </Button>
        {saved ? <span className="text-sm text-muted">Saved on this device</span> : null}
      </div>
      {error ? (
        <Notice tone="danger" title="Not saved" className="md:col-span-2">
          {error}
        </Notice>
      ) : null}
    </form>
  );
}
