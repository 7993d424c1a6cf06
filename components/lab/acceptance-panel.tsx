"use client";

import dynamic from "next/dynamic";
import clsx from "clsx";
import { CircleCheck } from "lucide-react";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";
import { Notice } from "@/components/ui/notice";
import type { MixAcceptance } from "@/lib/checks/strength";
import { citation } from "@/lib/checks/types";
import { RULE_AVERAGE, RULE_INDIVIDUAL } from "@/lib/checks/strength";
import { strengthText } from "./format";
import { Table } from "@/components/ui/table";

// recharts loads on demand: the figures beside the chart are what the first paint needs.
const RunningAverageChart = dynamic(() => import("./charts").then((m) => m.RunningAverageChart), { ssr: false });
const WARNING = SEVERITY_WORDS.warning;

/** ACI 318 acceptance of one mix on the project: verdict, low-result flags, tests, chart. */
export function AcceptancePanel({ acceptance: a }: { acceptance: MixAcceptance }) {
  const u = a.unitSystem;
  const verdict = a.ok === null ? "No strength test at the design age yet" : a.ok ? (a.averageJudged ? "Meets ACI 318 acceptance so far" : "No low test so far; the three-test average needs three tests") : "Does not meet ACI 318 acceptance";
  return (
    <section className="card p-4" data-testid="acceptance-panel" data-mix={a.mix.code} aria-labelledby={`acc-${a.mix.id}`}>
      <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h3 id={`acc-${a.mix.id}`} className="font-mono text-lg font-bold">{a.mix.code}</h3>
        <span className="text-sm">f′c {strengthText(a.mix.fcMPa, u)} at {a.mix.fcAgeDays} days · no test below {strengthText(a.individualLimitMPa, u)}</span>
        <span className={clsx("ml-auto inline-flex items-center gap-1 font-semibold", a.ok === false ? TONES[WARNING.tone].textClass : "text-ink-800")} data-testid="acceptance-verdict">
          {a.ok === false ? <VocabularyIcon name={WARNING.icon} /> : <CircleCheck className="h-4 w-4" aria-hidden="true" />}
          {verdict}
        </span>
      </div>
      {a.flags.length > 0 ? (
        <div className="mt-3 flex flex-col gap-2" data-testid="low-result-flag">
          {a.flags.map((f) => (
            <Notice key={`${f.kind}-${f.setCode}`} tone="danger" title={f.title}>
              <p>{f.detail}</p>
              <p className="mt-1 text-xs">Rule: {f.rule} Source: {citation(f.source)}.</p>
              <p className="mt-1 text-xs">{f.governs}</p>
            </Notice>
          ))}
          <Notice tone="caution" title="What usually follows a low result" testId="low-result-follow-up">
            <ol className="list-decimal pl-5">
              {a.followUp.steps.map((s) => <li key={s}>{s}</li>)}
            </ol>
            <p className="mt-1 font-semibold">{a.followUp.note}</p>
          </Notice>
        </div>
      ) : null}
      {a.tests.length > 0 ? (
        <div className="mt-3 grid gap-4 xl:grid-cols-2">
          <Table columns={["#", "Set", "Cylinders", { label: "Test", align: "right" }, { label: "Avg of 3", align: "right" }, "Result"]} testId="acceptance-tests" compact className="self-start">
              {a.tests.map((t, i) => {
                const low = t.lowIndividual || t.lowAverage === true;
                return (
                  <tr key={t.setId} className={clsx(low && "bg-danger-50")} data-testid="acceptance-test-row">
                    <td className="px-2 py-1.5 font-mono">{i + 1}</td>
                    <td className="px-2 py-1.5 font-mono">{t.setCode}</td>
                    <td className="px-2 py-1.5 font-mono text-xs">{t.cylindersMPa.map((c) => strengthText(c, u)).join(", ")}</td>
                    <td className="px-2 py-1.5 text-right font-mono font-semibold">{strengthText(t.averageMPa, u)}</td>
                    <td className="px-2 py-1.5 text-right font-mono">{strengthText(t.runningAverageMPa, u)}</td>
                    <td className="px-2 py-1.5">
                      {low ? (
                        <span className={`inline-flex items-center gap-1 font-semibold ${TONES[WARNING.tone].textClass}`}><VocabularyIcon name={WARNING.icon} className="h-3.5 w-3.5" />{t.lowIndividual ? "Low test" : "Low average"}</span>
                      ) : (
                        <span className="inline-flex items-center gap-1"><CircleCheck className="h-3.5 w-3.5" aria-hidden="true" />Meets</span>
                      )}
                    </td>
                  </tr>
                );
              })}
            </Table>
          <RunningAverageChart acceptance={a} />
        </div>
      ) : (
        <p className="mt-2 text-sm text-muted">No complete strength test at {a.mix.fcAgeDays} days yet.</p>
      )}
      <p className="mt-2 text-xs text-muted">{RULE_AVERAGE} {RULE_INDIVIDUAL} Early-age results (e.g. 7 days) are shown with their sets and not judged.</p>
    </section>
  );
}
