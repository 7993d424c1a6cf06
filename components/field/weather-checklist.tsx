"use client";

// A hot- or cold-weather checklist on a placement: the items, a yes / no / N/A answer and a note each.
import clsx from "clsx";
import { useLiveQuery } from "dexie-react-hooks";
import { ClipboardCheck } from "lucide-react";
import { RecordPhotos } from "@/components/photos/record-photos";
import { Notice } from "@/components/ui/notice";
import { listByParent, updateLocal, type LocalRecord } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { useDeviceWrite } from "./use-device-write";

export const HOT_ITEMS: [string, string][] = [
  ["materials-cooled", "Materials cooled or shaded; retarder as the mix allows"],
  ["placing-time", "Placing planned for the cooler hours"],
  ["subgrade-dampened", "Subgrade and forms dampened, no standing water"],
  ["windbreaks-shade", "Windbreaks and sunshades up"],
  ["fogging-ready", "Fogging or evaporation reducer on site"],
  ["curing-ready", "Curing materials ready to start at once after finishing"],
  ["cylinders-shaded", "Test cylinders shaded and kept in their curing range"],
  ["crew-heat", "Crew water, shade and rest breaks arranged"],
];
export const COLD_ITEMS: [string, string][] = [
  ["no-frozen-ground", "No frost or ice on the subgrade, forms or reinforcement"],
  ["heaters-vented", "Combustion heaters vented outside (carbon monoxide)"],
  ["enclosure-ready", "Enclosure or insulated blankets ready"],
  ["concrete-temp", "Concrete temperature at delivery at or above the minimum for the section"],
  ["thermometers", "Thermometers placed to log the protection period"],
  ["protection-removal", "Plan to remove protection gradually"],
  ["cylinders-protected", "Test cylinders protected from freezing"],
];

export function Checklist({ checklist, canWrite }: { checklist: LocalRecord<"checklists">; canWrite: boolean }) {
  const db = useSyncDb();
  const items = useLiveQuery(() => listByParent(db, "checklist-items", "checklistId", checklist.id), [db, checklist.id]);
  const { error, run } = useDeviceWrite();
  const order = (checklist.kind === "cold-weather" ? COLD_ITEMS : HOT_ITEMS).map(([key]) => key);
  const sorted = [...(items ?? [])].sort((a, b) => order.indexOf(a.itemKey) - order.indexOf(b.itemKey));
  const answer = (item: LocalRecord<"checklist-items">, patch: Record<string, unknown>) => run(() => updateLocal(db, "checklist-items", item.id, patch));
  const done = sorted.filter((i) => i.answer).length;
  return (
    <div className="mt-3 rounded-lg border border-ink-200 p-3" data-testid={`checklist-${checklist.kind}`}>
      <p className="flex items-center gap-2 text-lg font-bold">
        <ClipboardCheck className="h-5 w-5" aria-hidden="true" />
        {checklist.kind === "hot-weather" ? "Hot-weather checklist" : checklist.kind === "cold-weather" ? "Cold-weather checklist" : "Readiness checklist"}
        <span className="text-sm font-normal text-muted">
          {done} of {sorted.length} answered
        </span>
      </p>
      <ul className="mt-2 flex flex-col divide-y divide-ink-100">
        {sorted.map((item) => (
          <li key={item.id} className="py-2" data-testid="checklist-item">
            <p className="font-semibold">{item.label}</p>
            <div className="mt-1 grid grid-cols-3 gap-2" role="group" aria-label={item.label}>
              {(["yes", "no", "na"] as const).map((a) => (
                <button
                  key={a}
                  type="button"
                  aria-pressed={item.answer === a}
                  disabled={!canWrite}
                  onClick={() => void answer(item, { answer: item.answer === a ? null : a })}
                  className={clsx(
                    "min-h-touch rounded-lg border font-semibold",
                    item.answer === a ? (a === "no" ? "border-danger-600 bg-danger-50 text-danger-800" : "border-lichen-700 bg-lichen-50 text-lichen-900") : "border-ink-300 bg-white",
                  )}
                >
                  {a === "yes" ? "Yes" : a === "no" ? "No" : "N/A"}
                </button>
              ))}
            </div>
            {/* Read-only (a signed placement, a reader's role): the note as text, wrapped in full, never cut off in a disabled box. */}
            {canWrite ? (
              <input
                aria-label={`Note: ${item.label}`}
                placeholder="Note"
                defaultValue={(item.note ?? "")}
                onBlur={(e) => e.target.value !== (item.note ?? "") && void answer(item, { note: e.target.value || null })}
                className="mt-2 min-h-touch w-full rounded-lg border border-ink-300 px-3"
              />
            ) : (item.note ?? "") ? (
              <p className="mt-2 whitespace-pre-wrap break-words text-base" data-testid="checklist-note">
                {(item.note ?? "")}
              </p>
            ) : null}
            <RecordPhotos projectId={checklist.projectId} recordType="checklist-items" recordId={item.id} canAdd={canWrite} />
          </li>
        ))}
      </ul>
      {error ? <Notice tone="danger" title="Not saved">{error}</Notice> : null}
    </div>
  );
}
