// What stands on the site at the end of a day, beside the day's own records: holds in effect (with
// their reasons), the site visits' findings still open on that date (with their severity), and the
// diary's safety notes. The digest (text and HTML) and the PDF daily report both show these lines.
import { and, asc, eq, isNull, lte, ne } from "drizzle-orm";
import type { Executor } from "@/db";
import { diaryEntries, findings, placements, siteVisits } from "@/db/schema";
import type { FindingSeverity } from "@/lib/records/enums";
import { FINDING_SEVERITY_WORDS, FINDING_STATE_WORDS, placementStateLabel } from "@/lib/ui/vocabulary";

export type SiteStatus = {
  holds: { element: string; reason: string }[];
  openFindings: { severity: FindingSeverity; text: string }[];
  safetyNotes: string;
};

export const NO_SITE_STATUS: SiteStatus = { holds: [], openFindings: [], safetyNotes: "" };

/** Holds in effect now, findings of visits up to `date` not closed, and the safety notes of the day's diary. */
export async function loadSiteStatus(tx: Executor, projectId: string, date: string): Promise<SiteStatus> {
  const held = await tx
    .select({ element: placements.element, level: placements.level, holdReason: placements.holdReason })
    .from(placements)
    .where(and(eq(placements.projectId, projectId), eq(placements.state, "held"), isNull(placements.deletedAt)))
    .orderBy(asc(placements.plannedStart));
  const open = await tx
    .select({ f: findings, visitDate: siteVisits.visitDate, element: placements.element })
    .from(findings)
    .innerJoin(siteVisits, and(eq(siteVisits.id, findings.siteVisitId), eq(siteVisits.projectId, projectId)))
    .leftJoin(placements, eq(placements.id, findings.placementId))
    .where(and(eq(findings.projectId, projectId), isNull(findings.deletedAt), isNull(siteVisits.deletedAt), ne(findings.state, "closed"), lte(siteVisits.visitDate, date)))
    .orderBy(asc(siteVisits.visitDate));
  const [diary] = await tx
    .select({ safetyNotes: diaryEntries.safetyNotes })
    .from(diaryEntries)
    .where(and(eq(diaryEntries.projectId, projectId), eq(diaryEntries.date, date), isNull(diaryEntries.deletedAt)));
  const rank = (s: FindingSeverity) => ["minor", "major", "critical"].indexOf(s);
  return {
    holds: held.map((h) => ({ element: [h.element, h.level].filter(Boolean).join(", "), reason: h.holdReason?.trim() || "No reason recorded" })),
    openFindings: open
      .sort((a, b) => rank(b.f.severity) - rank(a.f.severity))
      .map(({ f, visitDate, element }) => ({
        severity: f.severity,
        text:
          `${FINDING_SEVERITY_WORDS[f.severity].label}, ${FINDING_STATE_WORDS[f.state].label.toLowerCase()}: ${f.description}` +
          `${f.location ? ` (${f.location})` : ""}${element ? `; placement ${element}` : ""}; visit of ${visitDate}${f.dueDate ? `; due ${f.dueDate}` : ""}`,
      })),
    safetyNotes: diary?.safetyNotes?.trim() ?? "",
  };
}

/** The held state's own word ("Held") for the heading of the holds. */
export const holdWord = () => placementStateLabel("held");

/** The lines of the site status as plain text (the digest's text part). */
export function siteStatusText(s: SiteStatus): string[] {
  const out: string[] = [];
  if (s.holds.length) out.push("", `${holdWord().toUpperCase()} (${s.holds.length})`, ...s.holds.map((h) => `- ${h.element}: ${h.reason}`));
  if (s.openFindings.length) out.push("", `OPEN FINDINGS OF SITE VISITS (${s.openFindings.length})`, ...s.openFindings.map((f) => `- ${f.text}`));
  if (s.safetyNotes) out.push("", "SAFETY NOTES", s.safetyNotes);
  return out;
}
