import { Info, ListChecks, Wind } from "lucide-react";
import { FindingNotice } from "@/components/findings/finding-notice";
import { Notice } from "@/components/ui/notice";
import type { EvaporationDescription } from "@/lib/concrete";
import type { WeatherCautions } from "./evaporation-model";

/** What to do about the rate, crew and weather cautions, and how far to trust the number. */
export function EvaporationGuidance({
  description,
  cautions,
}: {
  description: EvaporationDescription;
  cautions: WeatherCautions;
}) {
  return (
    <div className="flex flex-col gap-4">
      {description.negativeReason ? (
        <Notice title="No evaporation">
          {description.negativeReason}. The rate is reported as 0; the surface may collect condensation instead.
        </Notice>
      ) : null}

      <section aria-labelledby="evap-actions-title" className="card p-4">
        <h2 id="evap-actions-title" className="flex items-center gap-2 text-lg font-bold text-ink-950">
          <ListChecks className="h-5 w-5 text-lichen-700" aria-hidden="true" />
          What to do
        </h2>
        <ul className="mt-2 space-y-2 text-base text-ink-900">
          {description.actions.map((action) => (
            <li key={action} className="flex gap-2">
              <span aria-hidden="true" className="mt-2.5 h-1.5 w-1.5 shrink-0 rounded-full bg-lichen-600" />
              {action}
            </li>
          ))}
        </ul>
      </section>

      {[cautions.tooHotConcrete, cautions.hot, cautions.cold].map((finding) =>
        finding ? <FindingNotice key={finding.rule} finding={finding} testId={`evap-${finding.rule}`} /> : null,
      )}

      <section aria-labelledby="evap-notes-title" className="card p-4 text-sm text-ink-800">
        <h2 id="evap-notes-title" className="text-base font-bold text-ink-950">
          How far to trust the number
        </h2>
        <p className="mt-2 flex gap-2">
          <Info className="mt-0.5 h-4 w-4 shrink-0 text-ink-600" aria-hidden="true" />
          <span>{description.uncertaintyNote}</span>
        </p>
        <p className="mt-2 flex gap-2">
          <Wind className="mt-0.5 h-4 w-4 shrink-0 text-ink-600" aria-hidden="true" />
          <span>{description.windNote}</span>
        </p>
      </section>
    </div>
  );
}
