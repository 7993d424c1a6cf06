"use client";

// The readiness check on the placement screen: the superintendent answers the readiness checklist
// (yes / no / not applicable, with a note) before marking the placement ready; the inspector reads
// the same answers and clears or holds. Every write goes through the device's sync path.
import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { CircleAlert, CircleCheck, ClipboardCheck, OctagonAlert } from "lucide-react";
import { useState } from "react";
import { mayWrite } from "@/components/field/field-project";
import { Section } from "@/components/field/section";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { READINESS_ITEMS, readinessOrder, readinessVerdict, type ReadinessAnswer, type ReadinessVerdict } from "@/lib/placements/readiness";
import { createLocal, listByParent, updateLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import type { SyncDb } from "@/lib/sync/client/db";
import { useSyncDb } from "@/lib/sync/client/react";

export type Readiness = { checklist: LocalRecord<"checklists"> | null; items: LocalRecord<"checklist-items">[]; verdict: ReadinessVerdict };

async function loadReadiness(db: SyncDb, placementId: string): Promise<Readiness> {
  const lists = (await listByParent(db, "checklists", "placementId", placementId))
    .filter((c) => c.kind === "readiness")
    .sort((a, b) => (a.createdAt ?? "").localeCompare((b.createdAt ?? "")) || a.id.localeCompare(b.id));
  const checklist = lists[0] ?? null;
  const items = checklist
    ? (await listByParent(db, "checklist-items", "checklistId", checklist.id)).sort((a, b) =>
        readinessOrder({ itemKey: a.itemKey, label: a.label }, { itemKey: b.itemKey, label: b.label }),
      )
    : [];
  const verdict = readinessVerdict(
    checklist ? items.map((i) => ({ itemKey: i.itemKey, label: i.label, answer: (i.answer as ReadinessAnswer | null) ?? null, note: (i.note ?? "") })) : null,
  );
  return { checklist, items, verdict };
}

/** The placement's readiness checklist (the first one, if a device made two) and its verdict. */
export function useReadiness(placementId: string | null): Readiness | undefined {
  const db = useSyncDb();
  return useLiveQuery(async () => (placementId ? loadReadiness(db, placementId) : undefined), [db, placementId]);
}

const ANSWERS: { value: ReadinessAnswer; label: string }[] = [
  { value: "yes", label: "Yes" },
  { value: "no", label: "No" },
  { value: "na", label: "N/A" },
];

function ItemRow({ item, editable, onChange }: { item: LocalRecord<"checklist-items">; editable: boolean; onChange: (patch: Record<string, unknown>) => void }) {
  const answer = item.answer as ReadinessAnswer | null;
  const note = (item.note ?? "");
  const needsNote = (answer === "no" || answer === "na") && !note.trim();
  return (
    <li className="py-3" data-testid="readiness-item" data-item-key={item.itemKey} data-answer={answer ?? ""}>
      <p className="font-semibold text-ink-950">{item.label}</p>
      {editable ? (
        <>
          <div className="mt-2 grid grid-cols-3 gap-2" role="group" aria-label={item.label}>
            {ANSWERS.map((a) => (
              <button
                key={a.value}
                type="button"
                aria-pressed={answer === a.value}
                data-testid={`readiness-answer-${a.value}`}
                onClick={() => onChange({ answer: answer === a.value ? null : a.value })}
                className={clsx(
                  "min-h-touch rounded-lg border-2 text-base font-semibold",
                  answer === a.value
                    ? a.value === "no"
                      ? "border-danger-600 bg-danger-50 text-danger-800"
                      : "border-lichen-700 bg-lichen-50 text-lichen-900"
                    : "border-ink-300 bg-white text-ink-900",
                )}
              >
                {a.label}
              </button>
            ))}
          </div>
          <input
            key={note}
            aria-label={`Note: ${item.label}`}
            placeholder={answer === "no" ? "What is wrong, and what is being done" : answer === "na" ? "Why it does not apply" : "Note (optional)"}
            defaultValue={note}
            data-testid="readiness-note"
            aria-invalid={needsNote || undefined}
            onBlur={(e) => e.target.value.trim() !== note.trim() && onChange({ note: e.target.value.trim() || null })}
            className={clsx("mt-2 min-h-touch w-full rounded-lg border bg-white px-3 text-base", needsNote ? "border-danger-600" : "border-ink-300")}
          />
        </>
      ) : (
        <p className="mt-1 flex flex-wrap items-center gap-2 text-base">
          <AnswerBadge answer={answer} />
          {note ? <span className="text-ink-900">{note}</span> : null}
        </p>
      )}
    </li>
  );
}

export function AnswerBadge({ answer }: { answer: ReadinessAnswer | null }) {
  if (!answer) {
    return (
      <span className="inline-flex items-center gap-1 rounded-full bg-ink-100 px-2 py-0.5 text-sm font-semibold text-ink-800">
        <CircleAlert className="h-4 w-4" aria-hidden="true" /> Not answered
      </span>
    );
  }
  const no = answer === "no";
  const Icon = no ? OctagonAlert : CircleCheck;
  return (
    <span
      data-testid="readiness-answer"
      className={clsx("inline-flex items-center gap-1 rounded-full px-2 py-0.5 text-sm font-semibold", no ? "bg-danger-50 text-danger-800" : "bg-lichen-50 text-lichen-800")}
    >
      <Icon className="h-4 w-4" aria-hidden="true" />
      {answer === "yes" ? "Yes" : no ? "No" : "Not applicable"}
    </span>
  );
}

/** States in which the readiness answers may still change (afterwards the inspector has judged them). */
const EDITABLE_STATES = new Set(["planned", "held"]);
const FINISHED_STATES = new Set(["cleared", "placing", "placed", "signed"]);

export function ReadinessCheck({ placement, project, readiness }: { placement: LocalRecord<"placements">; project: ProjectRow; readiness: Readiness | undefined }) {
  const db = useSyncDb();
  const { error, run } = useDeviceWrite();
  const [starting, setStarting] = useState(false);
  const state = placement.state;
  const canWrite = mayWrite(project, "checklist.write");
  const editable = canWrite && EDITABLE_STATES.has(state);
  const reviewing = state === "ready" && mayWrite(project, "placement.review");

  const start = async () => {
    setStarting(true);
    await run(async () => {
      const { id } = await createLocal(db, "checklists", placement.projectId, { placementId: placement.id, kind: "readiness" });
      for (const { itemKey, label } of READINESS_ITEMS) {
        await createLocal(db, "checklist-items", placement.projectId, { checklistId: id, itemKey, label });
      }
    });
    setStarting(false);
  };
  const change = (item: LocalRecord<"checklist-items">, patch: Record<string, unknown>) => run(() => updateLocal(db, "checklist-items", item.id, patch));

  if (readiness === undefined) return null;
  const { checklist, items, verdict } = readiness;
  return (
    <Section
      title="Readiness check"
      testId="readiness-check"
      // Finished once the inspector has cleared it: folded under its count so the day's records come first.
      folded={checklist && FINISHED_STATES.has(state) ? { summary: `${verdict.answered} of ${verdict.total} answered${verdict.noCount ? `, ${verdict.noCount} no` : ""}` } : undefined}
    >
      {!checklist ? (
        <>
          <p className="text-muted">No readiness checklist yet. It is answered before you ask for inspection.</p>
          {canWrite && EDITABLE_STATES.has(state) ? (
            <Button className="mt-3" data-testid="start-readiness" disabled={starting} onClick={() => void start()}>
              <ClipboardCheck className="h-5 w-5" aria-hidden="true" /> Start the readiness check
            </Button>
          ) : null}
        </>
      ) : (
        <>
          <p className="flex flex-wrap items-center gap-2 text-base" data-testid="readiness-summary">
            <span className="font-bold">
              {verdict.answered} of {verdict.total} answered
            </span>
            {verdict.noCount > 0 ? (
              <span className="inline-flex items-center gap-1 rounded-full bg-danger-50 px-2 py-0.5 text-sm font-semibold text-danger-800">
                <OctagonAlert className="h-4 w-4" aria-hidden="true" /> {verdict.noCount} answered no
              </span>
            ) : null}
          </p>
          {reviewing ? (
            <Notice tone="info" title="Ready for your review" className="mt-3" testId="readiness-review-note">
              Read the answers, check the work on site, then clear it to place or hold it with a reason. The project specification and the engineer of
              record govern what must be in place.
            </Notice>
          ) : null}
          <ul className="mt-1 flex flex-col divide-y divide-ink-100">
            {items.map((item) => (
              <ItemRow key={item.id} item={item} editable={editable} onChange={(patch) => void change(item, patch)} />
            ))}
          </ul>
          {editable && !verdict.ready ? (
            <div className="mt-2 rounded-lg bg-ink-50 p-3 text-sm text-ink-900" data-testid="readiness-problems">
              <p className="font-semibold">Before you can ask for inspection:</p>
              <ul className="mt-1 list-disc pl-5">
                {verdict.problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </div>
          ) : null}
        </>
      )}
      {error ? (
        <Notice tone="danger" title="Not saved" className="mt-2">
          {error}
        </Notice>
      ) : null}
    </Section>
  );
}
