"use client";

import dynamic from "next/dynamic";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";
import { kNToLbf, type UnitSystem } from "@/lib/concrete";
import { dueAt } from "@/lib/lab/due";
import type { LabSetView } from "@/lib/lab/queries";
import type { MixAcceptance } from "@/lib/checks/strength";
import { BreakForm } from "./break-form";
import { SetCuring } from "./set-curing";
import { cylinderText, dateText, dateTimeText, nominalCylinderText, strengthText } from "./format";
import { Table } from "@/components/ui/table";

// recharts loads on demand: the figures beside the chart are what the first paint needs.
const StrengthAgeChart = dynamic(() => import("./charts").then((m) => m.StrengthAgeChart), { ssr: false });

type Props = { projectId: string; set: LabSetView; unitSystem: UnitSystem; timeZone: string; canEnterBreaks: boolean; canEditSets?: boolean; acceptance: MixAcceptance | null };

/** One specimen set: its cylinders, breaks, strength tests, a strength-age chart and break entry. */
export function SetCard({ projectId, set, unitSystem: u, timeZone, canEnterBreaks, canEditSets = false, acceptance }: Props) {
  const lowSets = new Set(acceptance?.flags.filter((f) => f.kind === "individual").map((f) => f.setCode));
  const low = lowSets.has(set.setCode);
  return (
    <article className="card p-4" data-testid="set-card" data-set={set.setCode}>
      <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h3 className="font-mono text-lg font-bold">{set.setCode}</h3>
        <span className="text-sm">{set.placement.element} · mix <span className="font-mono">{set.mixCode ?? "—"}</span></span>
        <span className="text-sm text-muted">{set.count} cylinders {nominalCylinderText(set.cylinderDiameterMm, set.cylinderLengthMm, u)} · cast {dateTimeText(set.castAt, timeZone)}</span>
        {low ? <span className={`ml-auto inline-flex items-center gap-1 text-sm font-semibold ${TONES[SEVERITY_WORDS.warning.tone].textClass}`} data-testid="set-low"><VocabularyIcon name={SEVERITY_WORDS.warning.icon} />Low strength test</span> : null}
      </header>
      <p className="mt-1 text-sm">Test ages: {[...set.testAgesDays].sort((a, b) => a - b).map((age) => `${age} d (due ${dateText(dueAt(new Date(set.castAt), age), timeZone)})`).join(" · ")}</p>
      <SetCuring projectId={projectId} set={set} canEdit={canEditSets && set.placement.state !== "signed"} />
      {/* Grid items may shrink below their content; on a phone the break table scrolls in its own box. */}
      <div className="mt-3 grid gap-4 lg:grid-cols-[3fr_2fr] [&>*]:min-w-0">
        <div>
          {set.breaks.length === 0 ? <p className="text-sm text-muted">No breaks yet.</p> : (
            <div className="overflow-x-auto">
            <Table columns={["Tested", "Age", { label: "Load", align: "right" }, "Size", "Fracture", { label: "Strength", align: "right" }]} testId="break-table" compact>
                {set.breaks.map((b) => (
                  <tr key={b.id} data-testid="break-row">
                    <td className="whitespace-nowrap px-2 py-1">{dateTimeText(b.testedAt, timeZone)}</td>
                    <td className="px-2 py-1 font-mono">{b.ageDays} d</td>
                    <td className="px-2 py-1 text-right font-mono">{u === "SI" ? `${b.loadKN.toFixed(1)} kN` : `${Math.round(kNToLbf(b.loadKN)).toLocaleString("en-US")} lbf`}</td>
                    <td className="px-2 py-1 font-mono text-xs">{cylinderText(b.diameterMm, b.lengthMm, u)}</td>
                    <td className="px-2 py-1">{b.fractureType ? `Type ${b.fractureType}` : "—"}</td>
                    <td className="px-2 py-1 text-right font-mono font-semibold">{strengthText(b.strengthMPa, u)}</td>
                  </tr>
                ))}
              </Table>
            </div>
          )}
          {set.tests.length > 0 ? (
            <ul className="mt-2 text-sm" data-testid="set-tests">
              {set.tests.map((t) => (
                <li key={t.ageDays}>
                  <strong>{t.ageDays} days:</strong>{" "}
                  {acceptance && t.ageDays !== acceptance.mix.fcAgeDays ? (
                    <>mean {strengthText(t.meanMPa, u)} of {t.cylindersMPa.length} cylinders <span className="text-muted">· not the design age ({acceptance.mix.fcAgeDays} d), not judged</span></>
                  ) : t.averageMPa !== null ? (
                    <>strength test {strengthText(t.averageMPa, u)} ({t.cylindersMPa.length} cylinders)</>
                  ) : (
                    <>mean {strengthText(t.meanMPa, u)} of {t.cylindersMPa.length} so far; {t.incompleteReason}</>
                  )}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        {set.breaks.length > 0 ? (
          <StrengthAgeChart title="Strength against age" cylinders={set.breaks.map((b) => ({ ageDays: b.ageDays, strengthMPa: b.strengthMPa }))} fcMPa={acceptance?.mix.fcMPa ?? null} unitSystem={u} />
        ) : null}
      </div>
      {canEnterBreaks ? (
        <BreakForm
          projectId={projectId}
          set={{ id: set.id, castAt: set.castAt, cylinderDiameterMm: set.cylinderDiameterMm, cylinderLengthMm: set.cylinderLengthMm, testAgesDays: set.testAgesDays, testedAges: set.tests.map((t) => t.ageDays) }}
          unitSystem={u}
          timeZone={timeZone}
          judge={acceptance ? { fcAgeDays: acceptance.mix.fcAgeDays, individualLimitMPa: acceptance.individualLimitMPa } : null}
        />
      ) : null}
    </article>
  );
}
