// The PDF's in-place strength section: every placement whose temperature record runs during the
// report's day, judged as of the end of that day with the same view the field and the office use
// (lib/maturity/view), its maturity findings, and the cautions said beside every estimate.
import { formatTemperature, type UnitSystem } from "@/lib/concrete";
import { localTimeText } from "@/lib/checks/maturity";
import { warningWord } from "@/lib/ui/vocabulary";
import type { maturityOfPeriod } from "@/lib/maturity/records";
import { MATURITY_CAUTIONS, buildMaturityView, estimateText, targetText } from "@/lib/maturity/view";
import { MUTED, toneColour, type Layout } from "./pdf-layout";

type Placements = Awaited<ReturnType<typeof maturityOfPeriod>>;

const METHOD_WORDS = { "nurse-saul": "temperature-time factor (Nurse-Saul)", "equivalent-age": "equivalent age" } as const;

export function drawMaturitySection(l: Layout, placements: Placements, asOf: Date) {
  if (!placements.length) return;
  l.heading(`In-place strength by the maturity method (${placements.length})`);
  for (const { project, placement, mixCode, records } of placements) {
    const units: UnitSystem = project.unitSystem;
    const view = buildMaturityView({
      project,
      placement: { ...placement, plannedStart: placement.plannedStart.toISOString() },
      mixCode,
      ...records,
      targetMPa: project.maturityTargetMPa,
      now: asOf,
    });
    l.need(70);
    l.text(`${placement.element} · mix ${mixCode ?? "not set"} · ${METHOD_WORDS[view.settings.method]}`, { size: 10, bold: true, gap: 2 });
    l.row(["Sensor", "Where", "Readings", "Last reading", `Maturity (${view.unit})`], [0.18, 0.3, 0.12, 0.25, 0.15], { bold: true, color: MUTED });
    for (const s of view.assessment.sensors) {
      const last = s.series.at(-1);
      const where = String(records.sensors.find((r) => r.id === s.id)?.location ?? "");
      l.row(
        [
          s.name,
          where || "-",
          String(s.series.length),
          last ? `${formatTemperature(last.tempC, units)} at ${localTimeText(last.at, project.timeZone)}` : "-",
          s.maturity === null ? "-" : String(Math.round(s.maturity)),
        ],
        [0.18, 0.3, 0.12, 0.25, 0.15],
      );
    }
    const coldest = view.assessment.coldest ? ` (at ${view.assessment.coldest.name}, the least mature sensor)` : "";
    l.text(`Estimated in-place strength at ${localTimeText(asOf, project.timeZone)}: ${estimateText(view, units)}${view.assessment.estimate ? coldest : ""}`, { bold: true, gap: 1 });
    l.text(`Target: ${targetText(view, project.timeZone)}`, { gap: 2 });
    for (const f of view.findings) {
      const word = warningWord(f);
      l.text(`${word.label}: ${f.title}`, { color: toneColour(word.tone), gap: 1 });
    }
    l.y -= 4;
  }
  for (const caution of MATURITY_CAUTIONS) l.text(caution, { size: 7, color: MUTED, gap: 1 });
}
