// The day in plain sentences, in the project's units and time zone: what the HTML and the text
// parts of the digest both show. Pure.
import { formatStrength, formatTemperature, formatVolume, formatWaterVolume, mmToIn, toDisplay, unitLabel } from "@/lib/concrete";
import { placementStateLabel } from "@/lib/ui/vocabulary";
import type { PlacementState } from "@/lib/records/enums";
import { localDate } from "@/lib/time/zone";
import type { DigestWarning, Lookup } from "./checks";
import { testWarnings } from "./test-checks";
import { dischargeWarnings, waterWarnings } from "./truck-checks";
import { coldWarnings, evaporationWarnings } from "./weather-checks";
import { breakGroups, strengthWarnings } from "./strength";
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
  warnings: DigestWarning[];
  /** Nothing at all was recorded for the day. */
  isEmpty: boolean;
};

function formatters(timeZone: string) {
  const time = new Intl.DateTimeFormat("en-US", { timeZone, hour: "numeric", minute: "2-digit" });
  const dayTime = new Intl.DateTimeFormat("en-US", { timeZone, month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
  return { time, dayTime };
}

function dateLabels(date: string) {
  const [y, m, d] = date.split("-").map(Number);
  const noonUtc = new Date(Date.UTC(y, m - 1, d, 12));
  return {
    dateLong: new Intl.DateTimeFormat("en-US", { timeZone: "UTC", weekday: "long", month: "long", day: "numeric", year: "numeric" }).format(noonUtc),
    dateShort: new Intl.DateTimeFormat("en-US", { timeZone: "UTC", weekday: "short", month: "short", day: "numeric" }).format(noonUtc),
  };
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
  const lookup: Lookup = { placement: (id) => (id ? byId.get(id) : undefined), time };
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

  const discharge = dischargeWarnings(day, lookup);
  const lateTickets = new Set(discharge.filter((w) => w.kind === "late-truck").map((w) => w.title));
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
      late: [...lateTickets].some((t) => t.includes(`ticket ${d.ticketNumber}`)),
      rejected: d.status === "rejected" ? d.rejectReason || "Rejected at the site" : null,
      water: (d.waterAddedL ?? 0) > 0 ? `${formatWaterVolume(d.waterAddedL!, units)} water added at site` : null,
    };
  });
  const waterL = day.deliveries.reduce((s, d) => s + (d.waterAddedL ?? 0), 0);

  const groups = breakGroups(day, lookup);
  const warnings = [
    ...evaporationWarnings(day, lookup),
    ...coldWarnings(day),
    ...discharge,
    ...waterWarnings(day, lookup),
    ...testWarnings(day, lookup),
    ...strengthWarnings(groups, units),
  ];

  const size = (diameterMm: number, lengthMm: number) =>
    units === "SI" ? `${diameterMm} × ${Math.round(lengthMm)} mm` : `${Math.round(mmToIn(diameterMm))} × ${Math.round(mmToIn(lengthMm))} in`;
  const specimens = day.specimenSets.map(
    (s) =>
      `Set ${s.setCode}: ${plural(s.count, "cylinder")} ${size(s.cylinderDiameterMm, s.cylinderLengthMm)}, cast ${time(s.castAt)}` +
      ` (${lookup.placement(s.placementId)?.element ?? "placement"}); tests at ${listText(s.testAgesDays.map(String))} days`,
  );
  const breaks: BreakLine[] = groups.map((g) => {
    const each = g.strengthsMPa.map((v) => toDisplay("strength", v, units).toFixed(units === "SI" ? 1 : 0)).join(", ");
    const verdict = g.judged
      ? g.low
        ? `LOW: below the ${formatStrength(g.limitMPa!, units)} limit`
        : "meets the individual-test limit"
      : `information only; acceptance is judged at ${g.mix?.fcAgeDays ?? 28} days`;
    return {
      text: `Set ${g.setCode} (${g.placement?.element ?? "placement"}), ${g.ageDays} days: ${each} ${unitLabel("strength", units)}; average ${formatStrength(g.averageMPa, units)}, ${verdict}`,
      low: g.low,
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

  return {
    projectName: project.name,
    projectCode: project.code,
    ...dateLabels(date),
    placements,
    trucks: {
      lines: trucks,
      accepted: accepted.length,
      volume: vol(accepted.reduce((s, d) => s + d.volumeM3, 0)),
      late: lateTickets.size,
      rejected: day.deliveries.length - accepted.length,
      waterAdded: waterL > 0 ? formatWaterVolume(waterL, units) : null,
    },
    tests: { total: day.fieldTests.length, outOfTolerance: warnings.filter((w) => w.kind === "test").length },
    weather: {
      readings: day.weather.length,
      airRange: !airs.length ? null : Math.min(...airs) === Math.max(...airs) ? temp(airs[0]) : `${temp(Math.min(...airs))} to ${temp(Math.max(...airs))}`,
    },
    specimens,
    breaks,
    diary,
    photos: day.photos.map((p) => ({ id: p.id, label: `${p.caption || "Photo"}${p.takenAt ? ` (${time(p.takenAt)})` : ""}` })),
    warnings,
    isEmpty:
      day.placements.length + day.deliveries.length + day.fieldTests.length + day.weather.length + day.specimenSets.length +
        day.breaks.length + day.photos.length === 0 && day.diary === null,
  };
}
