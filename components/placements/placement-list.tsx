import { CircleCheck, CircleDot, CirclePause, Clock, Hammer, ShieldCheck, Truck } from "lucide-react";
import { formatVolume, type UnitSystem } from "@/lib/concrete/units";
import type { PlacementState } from "@/lib/records/enums";
import type { PlacementListItem } from "@/lib/placements/queries";
import { STATE_LABELS } from "@/lib/placements/workflow";

// Every state has a word and an icon (never colour alone); held is the one warning.
const STATE_ICONS: Record<PlacementState, typeof Clock> = {
  planned: Clock,
  ready: CircleDot,
  cleared: CircleCheck,
  placing: Truck,
  placed: Hammer,
  signed: ShieldCheck,
  held: CirclePause,
};

export function PlacementList({ placements, unitSystem, timeZone }: { placements: PlacementListItem[]; unitSystem: UnitSystem; timeZone: string }) {
  if (placements.length === 0) return <p className="mt-2 text-muted" data-testid="no-placements">No placements yet.</p>;
  const when = new Intl.DateTimeFormat("en-US", { timeZone, weekday: "short", month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
  return (
    <ul className="mt-2 divide-y divide-ink-100" data-testid="placement-list">
      {placements.map((p) => {
        const Icon = STATE_ICONS[p.state];
        return (
          <li key={p.id} className="flex flex-wrap items-start justify-between gap-2 py-3" data-testid="placement-row">
            <div className="min-w-0">
              <p className="font-semibold">{p.element}</p>
              <p className="text-sm text-muted">
                {[p.level, p.grid].filter(Boolean).join(" · ")}
                {p.mixCode ? ` · ${p.mixCode}` : ""}
                {p.plannedVolumeM3 !== null ? ` · ${formatVolume(p.plannedVolumeM3, unitSystem, 0)}` : ""}
              </p>
              <p className="text-sm text-muted">{when.format(p.plannedStart)}</p>
              {p.state === "held" && p.holdReason ? <p className="mt-1 text-sm font-medium text-caution-800">Held: {p.holdReason}</p> : null}
            </div>
            <span
              className={
                p.state === "held"
                  ? "inline-flex items-center gap-1.5 rounded-full border-2 border-caution-600 bg-caution-50 px-2.5 py-1 text-sm font-semibold text-caution-800"
                  : "inline-flex items-center gap-1.5 rounded-full border border-ink-300 bg-white px-2.5 py-1 text-sm font-semibold text-ink-800"
              }
              data-testid="placement-state"
            >
              <Icon className="h-4 w-4" aria-hidden="true" />
              {STATE_LABELS[p.state]}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
