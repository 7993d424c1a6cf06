// Builds one digest e-mail (subject, HTML and plain text) from a loaded day. Pure: the links are
// passed in, so the same day renders for the preview, each recipient and the tests.
import { renderEmptyHtml, renderHtml, type DigestLinks } from "./html";
import { citation } from "@/lib/checks";
import { siteStatusText } from "./site-status";
import { summarizeDay, type DigestSummary } from "./summary";
import { warningWord } from "@/lib/ui/vocabulary";
import type { DigestDay } from "./types";

export type { DigestLinks } from "./html";

export type DigestMessage = { subject: string; html: string; text: string; isEmpty: boolean; summary: DigestSummary };

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/** Links into the app for a project and day; photos open through the app, which checks the session. */
export function digestLinks(origin: string, projectId: string, date: string, unsubscribe: string | null): DigestLinks {
  const project = `${origin}/projects/${projectId}`;
  return {
    day: `${project}?date=${date}`,
    photo: (id) => `${project}/photos/${id}`,
    preferences: `${project}/digest`,
    unsubscribe,
  };
}

export function digestSubject(s: DigestSummary): string {
  if (s.isEmpty) return `${s.projectName}, ${s.dateShort}: No placements today`;
  const parts = [s.placements.length ? plural(s.placements.length, "placement") : "No placements"];
  if (s.warnings.length) parts.push(plural(s.warnings.length, "warning"));
  return `${s.projectName}, ${s.dateShort}: ${parts.join(", ")}`;
}

function renderText(s: DigestSummary, links: DigestLinks): string {
  const out: string[] = [`${s.projectName} (${s.projectCode}) daily digest, ${s.dateLong}`];
  const heading = (title: string) => out.push("", title.toUpperCase());
  if (s.warnings.length) {
    heading("Needs attention");
    for (const w of s.warnings) {
      out.push(`! ${warningWord(w).label}: ${w.title}${w.context ? ` (${w.context})` : ""}`, `  ${w.message}`, `  Rule: ${citation(w.source)}. ${w.governs}`);
    }
  }
  heading("Placements");
  if (s.placements.length === 0) out.push("No placements today.");
  for (const p of s.placements) {
    out.push(`- ${p.element} [${p.stateLabel}]`, `  ${[p.where, `start ${p.start}`].filter(Boolean).join(" · ")}`, `  ${p.volume}`, `  ${p.signed}`);
    if (p.holdReason) out.push(`  ${p.stateLabel}: ${p.holdReason}`);
  }
  out.push(...siteStatusText(s.site));
  if (s.trucks.lines.length) {
    const t = s.trucks;
    heading("Trucks");
    out.push(
      `${t.accepted} accepted, ${t.volume} delivered${t.rejected ? `; ${t.rejected} rejected` : ""}${t.late ? `; ${t.late} late` : ""}` +
        `${t.waterAdded ? `; ${t.waterAdded} water added at site` : ""}`,
    );
    for (const l of t.lines) {
      out.push(`- ${l.ticket} · ${l.volume}${l.placement ? ` · ${l.placement}` : ""}`, `  ${l.times}${l.late ? " (LATE)" : ""}`);
      if (l.water) out.push(`  ${l.water}`);
      if (l.rejected) out.push(`  Rejected: ${l.rejected}`);
    }
  }
  if (s.tests.total) {
    heading("Field tests");
    out.push(s.tests.outOfTolerance ? `${s.tests.total} field tests; ${s.tests.outOfTolerance} out of tolerance (see above).` : `${s.tests.total} field tests, all within tolerance.`);
  }
  if (s.weather.readings) {
    heading("Weather");
    out.push(`${plural(s.weather.readings, "reading")}; air ${s.weather.airRange}.`);
  }
  if (s.specimens.length || s.breaks.length) {
    heading("Specimens and breaks");
    if (s.specimens.length) out.push("Made today:", ...s.specimens.map((x) => `- ${x}`));
    if (s.breaks.length) out.push("Breaks received:", ...s.breaks.map((b) => `- ${b.low ? "! " : ""}${b.text}`));
  }
  if (s.diary) {
    heading("Diary");
    out.push(`Crew on site: ${s.diary.crewTotal}${s.diary.crew ? ` (${s.diary.crew})` : ""}`);
    if (s.diary.weatherSummary) out.push(`Weather: ${s.diary.weatherSummary}`);
    if (s.diary.workDone) out.push(s.diary.workDone);
    out.push(...(s.diary.delays.length ? ["Delays:", ...s.diary.delays.map((d) => `- ${d}`)] : ["No delays recorded."]));
    if (!s.diary.submitted) out.push("The superintendent has not submitted this diary yet.");
  }
  if (s.photos.length) {
    heading("Photos (open in Placewright after you sign in)");
    out.push(...s.photos.map((p) => `- ${p.label}: ${links.photo(p.id)}`));
  }
  out.push(
    "",
    `Open the day in Placewright: ${links.day}`,
    "",
    "The checks above apply published defaults; the project's specifications, local codes and the engineer of record govern.",
    `Change the hour or empty-day setting: ${links.preferences}`,
  );
  if (links.unsubscribe) out.push(`Unsubscribe: ${links.unsubscribe}`);
  return `${out.join("\n")}\n`;
}

export function buildDigest(day: DigestDay, links: DigestLinks): DigestMessage {
  const summary = summarizeDay(day);
  const subject = digestSubject(summary);
  if (summary.isEmpty) {
    const text =
      `${summary.projectName}, ${summary.dateLong}: No placements today. ${links.day}\n\n` +
      `Stop empty-day messages: ${links.preferences}\n${links.unsubscribe ? `Unsubscribe: ${links.unsubscribe}\n` : ""}`;
    return { subject, html: renderEmptyHtml(summary, subject, links), text, isEmpty: true, summary };
  }
  return { subject, html: renderHtml(summary, subject, links), text: renderText(summary, links), isEmpty: false, summary };
}
