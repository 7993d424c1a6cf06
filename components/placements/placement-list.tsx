import { StateBadge } from "@/components/ui/state-badge";
import { formatVolume, type UnitSystem } from "@/lib/concrete/units";
import type { PlacementListItem } from "@/lib/placements/queries";
import { placementStateLabel, textClassOf } from "@/lib/ui/vocabulary";
import { instantFormatter } from "@/lib/time/zone";

export function PlacementList({ placements, unitSystem, timeZone }: { placements: PlacementListItem[]; unitSystem: UnitSystem; timeZone: string }) {
  if (placements.length === 0) return <p className="mt-2 text-muted" data-testid="no-placements">No placements yet.</p>;
  const when = instantFormatter(timeZone, "weekdayDayTime");
  return (
    <ul className="mt-2 divide-y divide-ink-100" data-testid="placement-list">
      {placements.map((p) => {
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
              {p.state === "held" && p.holdReason ? <p className={`mt-1 text-sm font-semibold ${textClassOf("placement", p.state)}`}>{placementStateLabel(p.state)}: {p.holdReason}</p> : null}
            </div>
            <StateBadge kind="placement" code={p.state} testId="placement-state" />
          </li>
        );
      })}
    </ul>
  );
}
