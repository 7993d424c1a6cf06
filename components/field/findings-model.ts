// What the field screens show about the records on this device: the rulebook's findings (lib/checks),
// made from the device's rows exactly as the server makes them from its own (toCheckInput + evaluate).
// Pure: no React, no Dexie. The agreement test calls fieldFindings to show the phone and the server agree.
import { evaluate, toCheckInput, type Finding, type RuleId, type StoredRecords, type Subject } from "@/lib/checks";
import { localDate } from "@/lib/time/zone";

type Row = Record<string, unknown>;

/** A project's rows as the device stores them (ISO strings, SI units), tombstones allowed. */
export type FieldRecords = StoredRecords;

/** Every finding of the records, info included; `now` decides what a truck still discharging shows. */
export function fieldFindings(records: FieldRecords, now: Date): Finding[] {
  return evaluate(toCheckInput(records), { now });
}

const dateOf = (value: unknown, timeZone: string): string | null => {
  const d = value instanceof Date ? value : new Date(String(value));
  return Number.isNaN(d.getTime()) ? null : localDate(d, timeZone);
};

/**
 * The findings about one placement: those of its own records, and the day-level ones (cold weather)
 * on its planned day or on a day it has weather or curing readings.
 */
export function placementFindings(records: FieldRecords, findings: Finding[], placementId: string): Finding[] {
  const timeZone = String(records.project.timeZone || "UTC");
  const mine = (r: Row) => r.placementId === placementId && !r.deletedAt;
  const placement = records.placements.find((p) => p.id === placementId);
  const days = new Set(
    [placement?.plannedStart, ...(records.weather ?? []).filter(mine).map((w) => w.observedAt), ...(records.curing ?? []).filter(mine).map((c) => c.readAt)]
      .filter((v) => v !== undefined && v !== null)
      .map((v) => dateOf(v, timeZone)),
  );
  return findings.filter((f) => f.placementId === placementId || (f.subject.type === "day" && days.has(f.subject.id)));
}

/** The findings about one record. */
export const findingsFor = (findings: Finding[], type: Subject["type"], id: string, rule?: RuleId): Finding[] =>
  findings.filter((f) => f.subject.type === type && f.subject.id === id && (rule === undefined || f.rule === rule));

export const DRAFT_ID = "draft";

type DraftKind = "weather" | "fieldTests" | "deliveries" | "curing";

/**
 * The findings a record being typed would get, judged with the records already on the device (a
 * later test of the same load, the day's other readings). Empty when the rulebook cannot read the
 * draft yet; the save path names the bad field.
 */
export function draftFindings(records: FieldRecords, kind: DraftKind, draft: Row, now: Date): Finding[] {
  const row = { ...draft, id: DRAFT_ID, deletedAt: null };
  const withDraft: FieldRecords = { ...records, [kind]: [...(records[kind] ?? []).filter((r) => r.id !== draft.id), row] };
  try {
    return fieldFindings(withDraft, now).filter((f) => f.subject.id === DRAFT_ID);
  } catch {
    return [];
  }
}
