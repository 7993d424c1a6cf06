"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { Plus, Trash2 } from "lucide-react";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { DayPhotos } from "@/components/photos/day-photos";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { formatTemperature } from "@/lib/concrete";
import { createLocal, deleteLocal, listByParent, listByProject, updateLocal, type LocalRecord, type ProjectRow, type RecordType } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDirtyGuard } from "@/lib/ui/dirty-forms";
import { mayWrite, unitSystemOf, useFieldContext, useProjects } from "./field-project";
import { addDays, dateInZone } from "./project-time";
import { writeErrorOf } from "./write-error";
import { Section } from "./section";
import { calendarDateText } from "@/lib/time/zone";

type EntryValues = { weatherSummary: string; workDone: string; safetyNotes: string };

function EntryForm({ project, date, entry, weatherHint, canWrite }: { project: ProjectRow; date: string; entry: LocalRecord<"diary-entries"> | null; weatherHint: string; canWrite: boolean }) {
  const db = useSyncDb();
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, reset, formState } = useForm<EntryValues>({
    values: { weatherSummary: (entry?.weatherSummary ?? "") || (entry ? "" : weatherHint), workDone: (entry?.workDone ?? ""), safetyNotes: (entry?.safetyNotes ?? "") },
    resetOptions: { keepDirtyValues: true },
  });
  useDirtyGuard(`diary-${project.id}-${date}`, formState.isDirty);
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    setSaved(false);
    try {
      if (entry) await updateLocal(db, "diary-entries", entry.id, v);
      else await createLocal(db, "diary-entries", project.id, { date, ...v });
      reset(v);
      setSaved(true);
    } catch (error) {
      setFailure(writeErrorOf(error).message);
    }
  });
  return (
    <Section title="The day" testId="diary-entry">
      <form onSubmit={onSubmit} className="flex flex-col gap-3" noValidate>
        <Field label="Weather summary" data-testid="diary-weather" {...register("weatherSummary")} />
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
          Work done
          <textarea rows={4} data-testid="diary-work" className="rounded-lg border border-ink-300 p-3 text-base font-normal" {...register("workDone")} />
        </label>
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink-800">
          Safety notes
          <textarea rows={2} data-testid="diary-safety" className="rounded-lg border border-ink-300 p-3 text-base font-normal" {...register("safetyNotes")} />
        </label>
        {failure ? <Notice tone="danger" title="Not saved">{failure}</Notice> : null}
        {saved && !formState.isDirty ? <Notice tone="success" title="Saved on this device" /> : null}
        <Button type="submit" data-testid="diary-save" disabled={formState.isSubmitting || !canWrite}>
          {entry ? "Save the diary" : "Start the diary for this day"}
        </Button>
      </form>
    </Section>
  );
}

type LineSpec = {
  type: RecordType;
  title: string;
  testId: string;
  fields: { key: string; label: string; numeric?: boolean; unit?: string }[];
  describe: (r: LocalRecord) => string;
};

const LINES: LineSpec[] = [
  {
    type: "diary-crew",
    title: "Crew by trade",
    testId: "diary-crew",
    fields: [
      { key: "trade", label: "Trade" },
      { key: "count", label: "Workers", numeric: true, unit: "people" },
    ],
    describe: (r) => `${(r.trade ?? "")}: ${r.count ?? 0} people`,
  },
  {
    type: "diary-equipment",
    title: "Equipment",
    testId: "diary-equipment",
    fields: [
      { key: "name", label: "Equipment" },
      { key: "count", label: "How many", numeric: true, unit: "units" },
      { key: "hours", label: "Hours", numeric: true, unit: "h" },
    ],
    describe: (r) => `${(r.name ?? "")}${typeof r.count === "number" ? ` × ${r.count}` : ""}${typeof r.hours === "number" ? ` · ${r.hours} h` : ""}`,
  },
  {
    type: "diary-delays",
    title: "Delays",
    testId: "diary-delays",
    fields: [
      { key: "cause", label: "Cause" },
      { key: "minutes", label: "Lost", numeric: true, unit: "min" },
      { key: "description", label: "What happened" },
    ],
    describe: (r) => `${(r.cause ?? "")}: ${r.minutes ?? 0} min${r.description ? ` · ${r.description}` : ""}`,
  },
  {
    type: "diary-visitors",
    title: "Visitors",
    testId: "diary-visitors",
    fields: [
      { key: "name", label: "Name" },
      { key: "company", label: "Company" },
      { key: "purpose", label: "Purpose" },
    ],
    describe: (r) => [(r.name ?? ""), (r.company ?? ""), (r.purpose ?? "")].filter(Boolean).join(" · "),
  },
];

function Lines({ spec, entry, canWrite }: { spec: LineSpec; entry: LocalRecord<"diary-entries">; canWrite: boolean }) {
  const db = useSyncDb();
  const rows = useLiveQuery(() => listByParent(db, spec.type, "diaryEntryId", entry.id), [db, entry.id, spec.type]);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, reset, formState } = useForm<Record<string, string>>({ defaultValues: Object.fromEntries(spec.fields.map((f) => [f.key, ""])) });
  useDirtyGuard(`${spec.testId}-${entry.id}`, formState.isDirty);
  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    const values: Record<string, unknown> = { diaryEntryId: entry.id };
    for (const f of spec.fields) {
      const text = v[f.key].trim();
      if (f.numeric) values[f.key] = text === "" ? (f.key === "count" && spec.type === "diary-crew" ? undefined : null) : Number(text);
      else if (text) values[f.key] = text;
    }
    try {
      await createLocal(db, spec.type, entry.projectId, values);
      reset();
    } catch (error) {
      setFailure(writeErrorOf(error).message);
    }
  });
  return (
    <Section title={spec.title} testId={spec.testId}>
      <ul className="flex flex-col gap-2">
        {(rows ?? []).map((r) => (
          <li key={r.id} className="flex items-center gap-2 rounded-lg border border-ink-200 px-3 py-1" data-testid={`${spec.testId}-row`}>
            <span className="flex-1">{spec.describe(r)}</span>
            <Button variant="ghost" disabled={!canWrite} aria-label={`Remove ${spec.describe(r)}`} onClick={() => void deleteLocal(db, spec.type, r.id).catch(() => undefined)}>
              <Trash2 className="h-5 w-5" aria-hidden="true" />
            </Button>
          </li>
        ))}
      </ul>
      {canWrite ? (
      <form onSubmit={onSubmit} className="mt-2 grid gap-2 sm:grid-cols-3" noValidate>
        {spec.fields.map((f) => (
          <Field key={f.key} label={f.label} unit={f.unit} inputMode={f.numeric ? "numeric" : undefined} data-testid={`${spec.testId}-${f.key}`} {...register(f.key)} />
        ))}
        {failure ? (
          <Notice tone="danger" title="Not added" className="sm:col-span-3">
            {failure}
          </Notice>
        ) : null}
        <Button type="submit" variant="secondary" className="sm:col-span-3" data-testid={`${spec.testId}-add`}>
          <Plus className="h-5 w-5" aria-hidden="true" /> Add
        </Button>
      </form>
      ) : null}
    </Section>
  );
}

export function DiaryScreen() {
  const db = useSyncDb();
  const params = useSearchParams();
  const projects = useProjects();
  const { selectedProjectId } = useFieldContext();
  const project = projects?.find((p) => p.id === (params.get("project") ?? selectedProjectId)) ?? projects?.[0];
  const today = project ? dateInZone(new Date(), project.timeZone) : "";
  const date = params.get("date") ?? today;
  const entry = useLiveQuery(
    async () => (project ? ((await listByProject(db, "diary-entries", project.id)).find((e) => e.date === date) ?? null) : null),
    [db, project?.id, date],
  );
  const weatherHint = useLiveQuery(async () => {
    if (!project) return "";
    const obs = (await listByProject(db, "weather-observations", project.id)).filter((o) => dateInZone(new Date(o.observedAt), project.timeZone) === date);
    const temps = obs.map((o) => o.airTempC);
    if (temps.length === 0) return "";
    const units = unitSystemOf(project);
    return `Air ${formatTemperature(Math.min(...temps), units)} to ${formatTemperature(Math.max(...temps), units)}; ${obs.length} ${obs.length === 1 ? "observation" : "observations"}`;
  }, [db, project?.id, date]);

  if (projects === undefined || entry === undefined) return <p className="text-muted">Reading this device…</p>;
  if (!project) return <Notice title="No projects on this device yet.">They arrive with the first sync once you are online.</Notice>;
  const canWrite = mayWrite(project, "diary.write");
  const nav = (d: string) => `/field/diary?project=${project.id}&date=${d}`;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Daily diary" subtitle={`${project.name} · ${calendarDateText(date, "longDate")}`} />
      <div className="flex gap-2">
        <Link href={nav(addDays(date, -1))} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold" data-testid="diary-prev">
          Previous day
        </Link>
        {date !== today ? (
          <Link href={nav(today)} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold">
            Today
          </Link>
        ) : null}
        {date < today ? (
          <Link href={nav(addDays(date, 1))} className="inline-flex min-h-touch items-center rounded-lg border border-ink-300 bg-white px-4 font-semibold">
            Next day
          </Link>
        ) : null}
      </div>
      <EntryForm key={`${project.id}-${date}-${entry?.id ?? "new"}`} project={project} date={date} entry={entry} weatherHint={weatherHint ?? ""} canWrite={canWrite} />
      {!canWrite ? <p className="text-muted">The superintendent keeps the diary; you can read it here.</p> : null}
      {entry ? LINES.map((spec) => <Lines key={spec.type} spec={spec} entry={entry} canWrite={canWrite} />) : <p className="text-muted">Start the diary to add crew, equipment, delays and visitors.</p>}
      {entry ? (
        <div className="card px-4 pb-3">
          <RecordPhotos projectId={project.id} recordType="diary-entries" recordId={entry.id} canAdd={canAddPhotos(project)} title="Diary photos" />
        </div>
      ) : null}
      <DayPhotos projectId={project.id} date={date} timeZone={project.timeZone} canEdit={canAddPhotos(project)} />
    </div>
  );
}
