"use client";

// What the inspector signs for a placement, counted from the records on this device: trucks, tests,
// warnings raised, checklists, photos and what is still open (conflicts, unsent changes, uploads).
import { useLiveQuery } from "dexie-react-hooks";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { RECONCILE_WORDS, SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";
import { unitSystemOf } from "@/components/field/field-project";
import { fieldFindings, placementFindings } from "@/components/field/findings-model";
import { readFieldRecords } from "@/components/field/use-findings";
import { GOVERNS, attention } from "@/lib/checks";
import { formatVolume } from "@/lib/concrete";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import type { SyncDb } from "@/lib/sync/client/db";
import { useSyncDb } from "@/lib/sync/client/react";

export type PlacementSummary = {
  trucks: number;
  rejectedTrucks: number;
  volumeM3: number;
  /** Trucks with water added at site (the rulebook judges each one; this is the count for the record). */
  waterAddedTrucks: number;
  tests: number;
  /** The rulebook's cautions and warnings on the placement, counted by what they say ("Late truck" × 2). */
  raised: { label: string; count: number }[];
  /** Which lines of the summary the rulebook has something to say about (by the finding's subject): never a tick there. */
  flagged: { trucks: boolean; tests: boolean; weather: boolean };
  specimenSets: number;
  observations: number;
  curingReadings: number;
  checklists: { kind: string; answered: number; total: number; no: number }[];
  photos: number;
  photosUploading: number;
  conflicts: number;
  unsent: number;
};

const CHECKLIST_NAMES: Record<string, string> = { readiness: "Readiness", "hot-weather": "Hot weather", "cold-weather": "Cold weather" };

// The label of a finding is its title up to the colon: "Slump out of tolerance", "High evaporation".
function countRaised(titles: string[]): { label: string; count: number }[] {
  const counts = new Map<string, number>();
  for (const t of titles) {
    const label = t.split(":")[0];
    counts.set(label, (counts.get(label) ?? 0) + 1);
  }
  return [...counts].map(([label, count]) => ({ label, count }));
}

async function summarize(db: SyncDb, placement: LocalRecord<"placements">, project: ProjectRow): Promise<PlacementSummary> {
  const [deliveries, tests, sets, observations, curing, lists] = await Promise.all([
    listByParent(db, "deliveries", "placementId", placement.id),
    listByParent(db, "field-tests", "placementId", placement.id),
    listByParent(db, "specimen-sets", "placementId", placement.id),
    listByParent(db, "weather-observations", "placementId", placement.id),
    listByParent(db, "curing-readings", "placementId", placement.id),
    listByParent(db, "checklists", "placementId", placement.id),
  ]);
  const checklists = [];
  const items: LocalRecord<"checklist-items">[] = [];
  for (const list of lists) {
    const rows = await listByParent(db, "checklist-items", "checklistId", list.id);
    items.push(...rows);
    checklists.push({ kind: list.kind, answered: rows.filter((r) => r.answer).length, total: rows.length, no: rows.filter((r) => r.answer === "no").length });
  }
  const own = [placement, ...deliveries, ...tests, ...sets, ...observations, ...curing, ...lists, ...items];
  const ids = new Set(own.map((r) => r.id));
  // Photos are synced records: count every device's, not only the blobs this device holds.
  const [conflicts, photos] = await Promise.all([
    db.conflicts.filter((c) => ids.has(c.recordId)).toArray(),
    db.typedRecords("photos").where("recordId").anyOf([...ids]).filter((p) => !p.deletedAt).toArray(),
  ]);
  const records = await readFieldRecords(db, project);
  const raised = attention(placementFindings(records, fieldFindings(records, new Date()), placement.id));
  return {
    trucks: deliveries.length,
    rejectedTrucks: deliveries.filter((d) => d.status === "rejected").length,
    volumeM3: deliveries.filter((d) => d.status !== "rejected").reduce((sum, d) => sum + (d.volumeM3 ?? 0), 0),
    waterAddedTrucks: deliveries.filter((d) => (d.waterAddedL ?? 0) > 0).length,
    tests: tests.length,
    raised: countRaised(raised.map((f) => f.title)),
    flagged: {
      trucks: raised.some((f) => f.subject.type === "delivery"),
      // A missing specimen set is a finding on the placement itself (lib/checks/sampling.ts).
      tests: raised.some((f) => f.subject.type === "field-test" || f.subject.type === "strength-test" || f.subject.type === "placement"),
      weather: raised.some((f) => f.subject.type === "weather" || f.subject.type === "curing" || f.subject.type === "day"),
    },
    specimenSets: sets.length,
    observations: observations.length,
    curingReadings: curing.length,
    checklists,
    photos: photos.length,
    photosUploading: photos.filter((p) => !p.storedAt).length,
    conflicts: conflicts.filter((c) => c.kind === "conflict").length,
    unsent: own.filter((r) => r.pending).length,
  };
}

export function usePlacementSummary(placement: LocalRecord<"placements">, project: ProjectRow, mix: LocalRecord<"mix-designs"> | null): PlacementSummary | undefined {
  const db = useSyncDb();
  // The mix is read with the project's records; the parameter stays so a changed mix re-counts.
  return useLiveQuery(() => summarize(db, placement, project), [db, placement, project, mix]);
}

/** Open items that the device already knows will stop the sign-off (the server checks again). */
export function blockingReason(s: PlacementSummary | undefined): string | null {
  if (!s) return null;
  const parts: string[] = [];
  if (s.unsent) parts.push(`${s.unsent} ${s.unsent === 1 ? "change has" : "changes have"} not reached the server yet`);
  if (s.conflicts) parts.push(`${plural(s.conflicts, "change", "changes")} ${RECONCILE_WORDS.label.toLowerCase()}`);
  if (s.photosUploading) parts.push(`${s.photosUploading} ${s.photosUploading === 1 ? "photo is" : "photos are"} still uploading`);
  return parts.length ? `Not yet: ${parts.join(", ")}. Sync, then sign.` : null;
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function Line({ label, value, warn, testId }: { label: string; value: string; warn?: boolean; testId?: string }) {
  const word = warn ? SEVERITY_WORDS.caution : { tone: "done" as const, icon: "circle-check" as const };
  return (
    <li className="flex items-start gap-2 py-1" data-testid={testId} data-tone={word.tone}>
      <VocabularyIcon name={word.icon} className={`mt-0.5 h-5 w-5 shrink-0 ${TONES[word.tone].textClass}`} />
      <span>
        <span className="font-semibold">{label}:</span> {value}
      </span>
    </li>
  );
}

export function PlacementSignSummary({ summary, project }: { summary: PlacementSummary | undefined; project: ProjectRow }) {
  if (!summary) return <p className="text-muted">Counting the records on this device…</p>;
  const s = summary;
  const units = unitSystemOf(project);
  const warnings = [
    ...s.raised.map((r) => (r.count > 1 ? `${r.label} (${r.count})` : r.label)),
    s.rejectedTrucks ? plural(s.rejectedTrucks, "truck rejected", "trucks rejected") : null,
    ...s.checklists.filter((c) => c.no).map((c) => `${CHECKLIST_NAMES[c.kind] ?? c.kind} checklist: ${plural(c.no, "item", "items")} answered no`),
  ].filter((w): w is string => !!w);
  const open = [
    s.conflicts ? `${plural(s.conflicts, "change", "changes")} ${RECONCILE_WORDS.label.toLowerCase()}` : null,
    s.unsent ? plural(s.unsent, "unsent change", "unsent changes") : null,
    s.photosUploading ? plural(s.photosUploading, "photo uploading", "photos uploading") : null,
  ].filter((w): w is string => !!w);
  return (
    <ul className="flex flex-col text-base" data-testid="sign-summary">
      <Line
        testId="sign-summary-trucks"
        label="Trucks"
        value={`${plural(s.trucks, "truck", "trucks")}, ${formatVolume(s.volumeM3, units)} accepted`}
        warn={s.flagged.trucks || s.rejectedTrucks > 0}
      />
      <Line testId="sign-summary-tests" label="Field tests" value={`${plural(s.tests, "test", "tests")}, ${plural(s.specimenSets, "specimen set", "specimen sets")}`} warn={s.flagged.tests} />
      <Line
        testId="sign-summary-weather"
        label="Weather"
        value={`${plural(s.observations, "observation", "observations")}; curing ${plural(s.curingReadings, "reading", "readings")}`}
        warn={s.flagged.weather}
      />
      <Line testId="sign-summary-warnings" label="Warnings raised" value={warnings.length ? `${warnings.join("; ")}. ${GOVERNS}` : "none"} warn={warnings.length > 0} />
      <Line
        label="Checklists"
        value={s.checklists.length ? s.checklists.map((c) => `${CHECKLIST_NAMES[c.kind] ?? c.kind} ${c.answered}/${c.total}`).join(", ") : "none"}
      />
      <Line label="Photos" value={s.photos ? `${s.photos}${s.photosUploading ? `, ${s.photosUploading} uploading` : ""}` : "none"} />
      <Line testId="sign-summary-open" label="Open items" value={open.length ? open.join(", ") : "none on this device"} warn={open.length > 0} />
    </ul>
  );
}
