"use client";

// An office correction of one measured field of an unsigned record, through the records API
// (PATCH /api/projects/{projectId}/records/{type}/{id} with the version it was read at).
import { useRouter } from "next/navigation";
import { useState } from "react";
import { callApi } from "@/lib/api/client";
import { fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from "@/lib/concrete/units";

export function Correction({
  projectId,
  type,
  id,
  version,
  field,
  quantity,
  valueSI,
  unitSystem,
  label,
  testId,
}: {
  projectId: string;
  type: string;
  id: string;
  version: number;
  field: string;
  quantity: Quantity;
  valueSI: number | null;
  unitSystem: UnitSystem;
  label: string;
  testId: string;
}) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(valueSI === null ? "" : String(Math.round(toDisplay(quantity, valueSI, unitSystem) * 100) / 100));
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!editing) {
    return (
      <button type="button" className="ml-1 text-xs font-semibold text-lichen-800 underline-offset-2 hover:underline" data-testid={`${testId}-edit`} onClick={() => setEditing(true)}>
        Correct
      </button>
    );
  }
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const n = text.trim() === "" ? null : Number(text);
    if (n !== null && !Number.isFinite(n)) return setError(`${label} must be a number`);
    setBusy(true);
    const res = await callApi(`/api/projects/${projectId}/records/${type}/${id}`, {
      method: "PATCH",
      body: { baseVersion: version, patch: { [field]: n === null ? null : fromDisplay(quantity, n, unitSystem) } },
    });
    setBusy(false);
    if (!res.ok) return setError(res.error.fields?.[`patch.${field}`] ?? res.error.fields?.[field] ?? res.error.message);
    setEditing(false);
    setError(null);
    router.refresh();
  };
  return (
    <form onSubmit={submit} className="mt-1 flex flex-wrap items-center gap-1" data-testid={testId}>
      <label className="sr-only" htmlFor={`${testId}-input`}>{label}</label>
      <input id={`${testId}-input`} inputMode="decimal" value={text} onChange={(e) => setText(e.target.value)} className="w-20 rounded border border-ink-300 px-1.5 py-0.5 text-sm" />
      <span className="text-xs text-muted">{unitLabel(quantity, unitSystem)}</span>
      <button type="submit" disabled={busy} className="rounded bg-lichen-700 px-2 py-0.5 text-xs font-semibold text-white">Save</button>
      <button type="button" onClick={() => { setEditing(false); setError(null); }} className="rounded border border-ink-300 px-2 py-0.5 text-xs">Cancel</button>
      {error ? <span role="alert" className="w-full text-xs font-semibold text-danger-700">{error}</span> : null}
    </form>
  );
}
