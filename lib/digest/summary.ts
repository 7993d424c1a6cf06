// The day in plain sentences, in the project's units and time zone: what the HTML and the text
// parts of the digest both show. Pure.
import { formatStrength, formatTemperature, formatVolume, formatWaterVolume, mmToIn, toDisplay, unitLabel } from "@/lib/concrete";
import { placementStateLabel } from "@/lib/ui/vocabulary";
import type { PlacementState } from "@/lib/records/enums";
import { calendarDateText, instantFormatter, localDate } from "@/lib/time/zone";
import { attention, type Finding } from "@/lib/checks";
import { strengthTests } from "@/lib/checks/strength";
import { dayFindings } from "@/lib/findings/load";
import { NO_SITE_STATUS, type SiteStatus } from "./site-status";
import type { DigestDay, DigestPlacement } from "./types";

export type PlacementLine = { element: string; where: string; start: string; volume: string; state: PlacementState; stateLabel: string; signed: string; holdReason: string | null };
export type TruckLine = { ticket: string; placement: string; volume: string; times: string; late: boolean; rejected: string | null; water: string | null };
export type BreakLine = { text: string; low: boolean };

export type DigestSummary = {
  projectName: string;
  projectCode: string;
  dateLong: string;
  dateShort: string;
  placements: PlacementLine[];
  trucks: { lines: TruckLine[]; accepted: number; volume: string; late: number; rejected: number; waterAdded: string | null };
  tests: { total: number; outOfTolerance: number };
  weather: { readings: number; airRange: string | null };
  specimens: string[];
  breaks: BreakLine[];
  diary: { submitted: boolean; crewTotal: number; crew: string; delays: string[]; workDone: string; weatherSummary: string } | null;
  photos: { id: string; label: string }[];
  /** The rulebook's cautions and warnings for the day (lib/checks), most severe first, each with when and where. */
  warnings: (Finding & { context: string })[];
  /** Holds in effect, open findings of site visits, the diary's safety notes. */
  site: SiteStatus;
  /** Nothing at all was recorded for the day (what stands open on the site does not count). */
  isEmpty: boolean;
};

function formatters(timeZone: string) {
  const time = instantFormatter(timeZone, "time");
  const dayTime = instantFormatter(timeZone, "dayTime");
  return { time, dayTime };
}

function dateLabels(date: string) {
  return { dateLong: calendarDateText(date, "longDate"), dateShort: calendarDateText(date, "shortDate") };
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const listText = (items: string[]) => (items.length < 2 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`);

export function summarizeDay(day: DigestDay): DigestSummary {
  const { project, date } = day;
  const units = project.unitSystem;
  const f = formatters(project.timeZone);
  const byId = new Map<string, DigestPlacement>([...day.otherPlacements, ...day.placements].map((p) => [p.id, p]));
  // A time on another day (a sign-off the morning after) carries its date.
  const time = (d: Date) => (localDate(d, project.timeZone) === date ? f.time.format(d) : f.dayTime.format(d));
  const lookup = { placement: (id: string | null) => (id ? byId.get(id) : undefined) };
  const findings = dayFindings(day.checks, date);
  const warnings = attention(findings).map((f) => ({
    ...f,
    context: [f.subject.type === "day" ? "" : time(new Date(f.at)), f.placementId ? (lookup.placement(f.placementId)?.element ?? "") : "site"].filter(Boolean).join(" · "),
  }));
  const about = (type: string, id: string) => warnings.filter((w) => w.subject.type === type && w.subject.id === id);
  const vol = (m3: number) => formatVolume(m3, units, 1);

  const accepted = day.deliveries.filter((d) => d.status === "accepted");
  const placements: PlacementLine[] = day.placements.map((p) => {
    const delivered = accepted.filter((d) => d.placementId === p.id);
    const deliveredM3 = delivered.reduce((s, d) => s + d.volumeM3, 0);
    const volume = [
      p.plannedVolumeM3 !== null ? `${vol(p.plannedVolumeM3)} planned` : null,
      delivered.length ? `${vol(deliveredM3)} delivered in ${plural(delivered.length, "truck")}` : null,
    ].filter(Boolean).join(" · ");
    return {
      element: p.element,
      where: [p.level, p.grid, p.mix?.code].filter(Boolean).join(" · "),
      start: time(p.plannedStart),
      volume: volume || "Volume not recorded",
      state: p.state,
      stateLabel: placementStateLabel(p.state),
      signed: p.signedAt && p.signedByName ? `Signed by ${p.signedByName} at ${time(p.signedAt)}` : "Not signed yet",
      holdReason: p.state === "held" ? p.holdReason : null,
    };
  });

  const late = new Set(warnings.filter((w) => w.rule === "discharge-time").map((w) => w.subject.id));
  // Name the placement beside each truck only when the day's trucks went to more than one.
  const severalPlacements = new Set(day.deliveries.map((d) => d.placementId)).size > 1;
  const trucks: TruckLine[] = day.deliveries.map((d) => {
    const minutes = d.dischargeFinishedAt ? Math.round((d.dischargeFinishedAt.getTime() - d.batchedAt.getTime()) / 60_000) : null;
    return {
      ticket: `Ticket ${d.ticketNumber}${d.truck ? ` · truck ${d.truck}` : ""}`,
      placement: severalPlacements ? (lookup.placement(d.placementId)?.element ?? "") : "",
      volume: vol(d.volumeM3),
      times:
        minutes !== null
          ? `Batched ${time(d.batchedAt)}, discharged by ${time(d.dischargeFinishedAt!)} (${minutes} min)`
          : `Batched ${time(d.batchedAt)}, arrived ${time(d.arrivedAt)}`,
      late: late.has(d.id),
      rejected: d.status === "rejected" ? d.rejectReason || "Rejected at the site" : null,
      water: (d.waterAddedL ?? 0) > 0 ? `${formatWaterVolume(d.waterAddedL!, units)} water added at site` : null,
    };
  });
  const waterL = day.deliveries.reduce((s, d) => s + (d.waterAddedL ?? 0), 0);

  const size = (diameterMm: number, lengthMm: number) =>
    units === "SI" ? `${diameterMm} × ${Math.round(lengthMm)} mm` : `${Math.round(mmToIn(diameterMm))} × ${Math.round(mmToIn(lengthMm))} in`;
  const specimens = day.specimenSets.map(
    (s) =>
      `Set ${s.setCode}: ${plural(s.count, "cylinder")} ${size(s.cylinderDiameterMm, s.cylinderLengthMm)}, cast ${time(s.castAt)}` +
      ` (${lookup.placement(s.placementId)?.element ?? "placement"}); tests at ${listText(s.testAgesDays.map(String))} days`,
  );
  // Breaks counted into strength tests as ACI 318 does (lib/checks/strength), from the same records the
  // rulebook judged; a test is listed when one of its cylinders was broken on the day.
  const brokenToday = new Set(day.breaks.map((b) => `${b.specimenSetId}:${b.ageDays}`));
  const tests = strengthTests(
    day.checks.specimenSets.map((s) => ({ ...s, count: 0, testAgesDays: [] })),
    day.checks.breaks.map((b) => ({ ...b, loadKN: 0, diameterMm: 0, lengthMm: null, fractureType: null, version: 0 })),
  ).filter((row) => brokenToday.has(`${row.setId}:${row.ageDays}`));
  const breaks: BreakLine[] = tests.map((row) => {
    const p = lookup.placement(row.placementId);
    const each = row.cylindersMPa.map((v) => toDisplay("strength", v, units).toFixed(units === "SI" ? 1 : 0)).join(", ");
    const low = about("strength-test", `${row.setId}:${row.ageDays}`).find((w) => w.rule === "strength-low");
    const verdict =
      row.averageMPa === null
        ? `not yet a strength test (${row.cylindersMPa.length} of ${row.needed} cylinders)`
        : low
          ? `LOW: below the ${Number(low.applied.limit!.toFixed(units === "SI" ? 1 : 0))} ${low.applied.unit} limit`
          : row.ageDays === p?.mix?.fcAgeDays
            ? "meets the individual-test limit"
            : `information only; acceptance is judged at ${p?.mix?.fcAgeDays ?? 28} days`;
    const average = row.averageMPa === null ? `mean ${formatStrength(row.meanMPa, units)}` : `average ${formatStrength(row.averageMPa, units)}`;
    return {
      text: `Set ${row.setCode} (${p?.element ?? "placement"}), ${row.ageDays} days: ${each} ${unitLabel("strength", units)}; ${average}, ${verdict}`,
      low: low !== undefined,
    };
  });

  const airs = day.weather.map((w) => w.airTempC);
  const temp = (c: number) => formatTemperature(c, units);
  const diary = day.diary && {
    submitted: day.diary.submitted,
    crewTotal: day.diary.crew.reduce((s, c) => s + c.count, 0),
    crew: day.diary.crew.map((c) => `${c.trade} ${c.count}`).join(", "),
    delays: day.diary.delays.map((d) => `${d.cause}${d.minutes > 0 ? `, ${d.minutes} min` : ""}${d.description ? `: ${d.description}` : ""}`),
    workDone: day.diary.workDone,
    weatherSummary: day.diary.weatherSummary,
  };

  const site = day.site ?? NO_SITE_STATUS;
  return {
    projectName: project.name,
    projectCode: project.code,
    ...dateLabels(date),
    placements,
    trucks: {
      lines: trucks,
      accepted: accepted.length,
      volume: vol(accepted.reduce((s, d) => s + d.volumeM3, 0)),
      late: late.size,
      rejected: day.deliveries.length - accepted.length,
      waterAdded: waterL > 0 ? formatWaterVolume(waterL, units) : null,
    },
    tests: { total: day.fieldTests.length, outOfTolerance: new Set(warnings.filter((w) => w.subject.type === "field-test").map((w) => w.subject.id)).size },
    weather: {
      readings: day.weather.length,
      airRange: !airs.length ? null : Math.min(...airs) === Math.max(...airs) ? temp(airs[0]) : `${temp(Math.min(...airs))} to ${temp(Math.max(...airs))}`,
    },
    specimens,
    breaks,
    diary,
    photos: day.photos.map((p) => ({ id: p.id, label: `${p.caption || "Photo"}${p.takenAt ? ` (${time(p.takenAt)})` : ""}` })),
    warnings,
    site,
    isEmpty:
      day.placements.length + day.deliveries.length + day.fieldTests.length + day.weather.length + day.specimenSets.length +
        day.breaks.length + day.photos.length === 0 && day.diary === null,
  };
}
