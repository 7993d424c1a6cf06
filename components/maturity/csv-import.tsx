"use client";

import { useEffect, useRef, useState } from "react";
import { unitSystemOf } from "@/components/field/field-project";
import { formatDateTime } from "@/components/field/project-time";
import { writeErrorOf } from "@/components/field/write-error";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { createLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { answer, type WorkerAnswer, type WorkerAsk } from "./csv-import-protocol";

type Opened = Extract<WorkerAnswer, { type: "opened" }>;
type Checked = Extract<WorkerAnswer, { type: "checked" }>;

const zones = (projectZone: string): string[] => {
  const all = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return [...new Set([projectZone, "UTC", ...all])];
};

/** Preview → pick columns, unit, zone → check (bad rows listed) → confirm; nothing is stored before the confirm. */
export function CsvImport({ sensor, project, onDone }: { sensor: LocalRecord<"temperature-sensors">; project: ProjectRow; onDone: () => void }) {
  const db = useSyncDb();
  const worker = useRef<Worker | null>(null);
  const onPage = useRef<{ table: null | Parameters<typeof answer>[1]["table"] } | null>(null);
  const [opened, setOpened] = useState<Opened | null>(null);
  const [checked, setChecked] = useState<Checked | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [opts, setOpts] = useState({ timeColumn: 0, tempColumn: 1, firstDataLine: 2, unit: unitSystemOf(project) === "IP" ? "F" : "C", timeZone: project.timeZone });

  const pending = useRef<WorkerAsk | null>(null);
  const receive = (a: WorkerAnswer) => {
    pending.current = null;
    setBusy(null);
    if (a.type === "failed") setFailure(a.message);
    if (a.type === "opened") {
      setOpened(a);
      setOpts((o) => ({ ...o, ...a.guess }));
    }
    if (a.type === "checked") setChecked(a);
  };
  useEffect(() => {
    // A classic worker: the bundler's worker bootstrap loads its chunks with importScripts.
    const w = new Worker(new URL("./csv-import.worker.ts", import.meta.url));
    w.onmessage = (event: MessageEvent<WorkerAnswer>) => receive(event.data);
    // Offline, the service worker's cached copy of the bundler's worker bootstrap loses its start-up
    // parameters, so the worker cannot start: the file is then read on the page itself.
    w.onerror = (event) => {
      event.preventDefault();
      onPage.current ??= { table: null };
      const waiting = pending.current;
      if (waiting) void answer(waiting, onPage.current).then(receive);
    };
    worker.current = w;
    return () => w.terminate();
  }, []);

  const ask = (message: WorkerAsk, doing: string) => {
    setFailure(null);
    setBusy(doing);
    pending.current = message;
    if (onPage.current) {
      const state = onPage.current;
      // Let the "reading" message paint before the page thread is busy.
      setTimeout(() => void answer(message, state).then(receive), 50);
    } else {
      worker.current?.postMessage(message);
      // The bootstrap's failure is not always reported as an error event: a worker that has not
      // answered after a few seconds is given up and the page reads the file itself.
      setTimeout(() => {
        if (pending.current !== message) return;
        onPage.current ??= { table: null };
        void answer(message, onPage.current).then(receive);
      }, 4_000);
    }
  };
  const change = (patch: Partial<typeof opts>) => {
    setOpts((o) => ({ ...o, ...patch }));
    setChecked(null);
  };
  const confirm = async () => {
    if (!checked) return;
    setFailure(null);
    try {
      for (let i = 0; i < checked.batches.length; i += 1) {
        setProgress(i);
        await createLocal(db, "sensor-readings", sensor.projectId, { sensorId: sensor.id, source: "import", readings: checked.batches[i] });
      }
      onDone();
    } catch (error) {
      setFailure(`Stopped after ${progress ?? 0} of ${checked.batches.length} batches: ${writeErrorOf(error).message}`);
    }
  };

  const columns = opened ? Math.max(...opened.head.map((r) => r.length)) : 0;
  const columnOptions = Array.from({ length: columns }, (_, i) => (
    <option key={i} value={i}>
      Column {i + 1}
      {opened?.head[opts.firstDataLine - 2]?.[i] ? `: ${opened.head[opts.firstDataLine - 2][i]}` : ""}
    </option>
  ));
  return (
    <div className="mt-3 flex flex-col gap-3 rounded-lg border-2 border-lichen-600 p-3" data-testid="csv-import">
      <label className="text-sm font-semibold text-ink-800">
        Logger file (CSV)
        <input type="file" accept=".csv,.txt,text/csv" className="mt-1 block w-full text-base" data-testid="csv-file"
          onChange={(e) => { const file = e.target.files?.[0]; if (file) { setChecked(null); ask({ type: "open", file }, "Reading the file…"); } }} />
      </label>
      {opened ? (
        <>
          <div className="overflow-x-auto">
            <table className="text-sm" data-testid="csv-preview">
              <tbody>
                {opened.head.map((row, i) => (
                  <tr key={i} className={i + 1 < opts.firstDataLine ? "text-muted" : ""}>
                    <th className="pr-2 text-right font-normal text-muted">{i + 1}</th>
                    {row.map((cell, j) => (
                      <td key={j} className={`whitespace-nowrap px-2 ${j === opts.timeColumn || j === opts.tempColumn ? "font-semibold" : ""}`}>{cell}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="text-xs text-muted">{opened.lines.toLocaleString("en-US")} lines in the file.</p>
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            <Select label="Time column" value={opts.timeColumn} onChange={(e) => change({ timeColumn: Number(e.target.value) })} data-testid="csv-time-column">{columnOptions}</Select>
            <Select label="Temperature column" value={opts.tempColumn} onChange={(e) => change({ tempColumn: Number(e.target.value) })} data-testid="csv-temp-column">{columnOptions}</Select>
            <Select label="First data line" value={opts.firstDataLine} onChange={(e) => change({ firstDataLine: Number(e.target.value) })}>
              {opened.head.map((_, i) => <option key={i} value={i + 1}>Line {i + 1}</option>)}
            </Select>
            <Select label="Unit in the file" value={opts.unit} onChange={(e) => change({ unit: e.target.value })} data-testid="csv-unit">
              <option value="C">°C</option>
              <option value="F">°F</option>
            </Select>
            <Select label="Time zone of times without an offset" value={opts.timeZone} onChange={(e) => change({ timeZone: e.target.value })} data-testid="csv-zone">
              {zones(project.timeZone).map((z) => <option key={z} value={z}>{z}</option>)}
            </Select>
          </div>
          {!checked ? (
            <Button data-testid="csv-check" disabled={busy !== null} onClick={() => ask({ type: "check", options: { ...opts, unit: opts.unit === "F" ? "F" : "C" } }, "Checking every row…")}>Check the rows</Button>
          ) : null}
        </>
      ) : null}
      {busy ? <p className="text-sm text-muted" role="status">{busy}</p> : null}
      {checked ? (
        <div className="flex flex-col gap-2" data-testid="csv-result">
          <p className="font-semibold" data-testid="csv-count">
            {checked.count.toLocaleString("en-US")} readings ready{checked.firstAt && checked.lastAt ? `, ${formatDateTime(checked.firstAt, project.timeZone)} to ${formatDateTime(checked.lastAt, project.timeZone)}` : ""}.
          </p>
          {checked.badCount > 0 ? (
            <Notice tone="caution" title={`${checked.badCount} row${checked.badCount === 1 ? "" : "s"} will not be imported`} testId="csv-bad">
              <ul className="max-h-48 overflow-y-auto">
                {checked.bad.map((b) => <li key={b.line} data-testid="csv-bad-row">Line {b.line}: {b.reason}</li>)}
              </ul>
              {checked.badCount > checked.bad.length ? <p>…and {checked.badCount - checked.bad.length} more.</p> : null}
            </Notice>
          ) : null}
          {progress !== null ? <p className="text-sm text-muted" role="status">Saving batch {progress + 1} of {checked.batches.length}…</p> : null}
        </div>
      ) : null}
      {failure ? <Notice tone="danger" title="Not imported">{failure}</Notice> : null}
      <div className="flex gap-2">
        {checked && checked.count > 0 ? (
          <Button data-testid="csv-confirm" disabled={progress !== null} onClick={() => void confirm()}>Import {checked.count.toLocaleString("en-US")} readings</Button>
        ) : null}
        <Button variant="secondary" onClick={onDone} disabled={progress !== null}>Cancel</Button>
      </div>
    </div>
  );
}
