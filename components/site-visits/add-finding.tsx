"use client";

// A new finding on a draft or submitted visit: what does not conform, where, how serious, the
// requirement, the action and its due date, and the placement it holds up (named as on its screen).
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { FINDING_SEVERITIES } from "@/lib/records/enums";
import { wordFor } from "@/lib/ui/vocabulary";
import { createLocal, type LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { placementName } from "./visit-model";

export function AddFinding({ visit, placements }: { visit: LocalRecord<"site-visits">; placements: LocalRecord<"placements">[] }) {
  const db = useSyncDb();
  const empty = { description: "", location: "", severity: "major", requirement: "", actionRequired: "", dueDate: "", placementId: "" };
  const [v, setV] = useState(empty);
  const [open, setOpen] = useState(false);
  const { error, run } = useDeviceWrite();
  const set = (k: keyof typeof empty) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV((x) => ({ ...x, [k]: e.target.value }));
  if (!open) {
    return (
      <Button variant="secondary" data-testid="add-finding" onClick={() => setOpen(true)}>
        Add a finding
      </Button>
    );
  }
  const save = () =>
    run(async () => {
      await createLocal(db, "findings", visit.projectId, { ...v, siteVisitId: visit.id, dueDate: v.dueDate || null, placementId: v.placementId || null });
      setV(empty);
      setOpen(false);
    });
  return (
    <form
      className="grid gap-3 rounded border border-ink-200 p-3 md:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <Field label="What does not conform" value={v.description} onChange={set("description")} data-testid="finding-description" />
      <Field label="Where" value={v.location} onChange={set("location")} data-testid="finding-location" />
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
        Severity
        <select className="min-h-touch rounded border border-ink-300 px-2 text-base font-normal" value={v.severity} onChange={set("severity")} data-testid="finding-severity">
          {FINDING_SEVERITIES.map((s) => (
            <option key={s} value={s}>
              {wordFor("finding-severity", s).label}
            </option>
          ))}
        </select>
      </label>
      <Field label="Requirement it breaks (spec section or drawing)" value={v.requirement} onChange={set("requirement")} data-testid="finding-requirement" />
      <Field label="Action required" value={v.actionRequired} onChange={set("actionRequired")} data-testid="finding-action" />
      <Field label="By (due date)" type="date" value={v.dueDate} onChange={set("dueDate")} data-testid="finding-due" />
      <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
        Placement it holds up
        <select className="min-h-touch rounded border border-ink-300 px-2 text-base font-normal" value={v.placementId} onChange={set("placementId")} data-testid="finding-placement">
          <option value="">None</option>
          {placements.map((p) => (
            <option key={p.id} value={p.id}>
              {placementName(p)}
            </option>
          ))}
        </select>
      </label>
      <div className="flex gap-2 md:col-span-2">
        <Button type="submit" data-testid="finding-save">
          Save finding
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
      {error ? (
        <Notice tone="danger" title="Not saved" className="md:col-span-2">
          {error}
        </Notice>
      ) : null}
    </form>
  );
}
