// The daily report's site status: holds in effect with their reasons, the open findings of site
// visits with their severity, and the diary's safety notes (the digest shows the same lines).
import type { SiteStatus } from "@/lib/digest/site-status";
import { placementStateLabel } from "@/lib/ui/vocabulary";
import { CAUTION, DANGER, MUTED, type Layout } from "./pdf-layout";

export function drawSiteStatus(l: Layout, site: SiteStatus): void {
  l.heading(`${placementStateLabel("held")} (${site.holds.length})`);
  if (!site.holds.length) l.text("No placement is held.", { color: MUTED });
  for (const h of site.holds) l.text(`${h.element}: ${h.reason}`, { color: DANGER, gap: 2 });

  l.heading(`Open findings of site visits (${site.openFindings.length})`);
  if (!site.openFindings.length) l.text("No open findings.", { color: MUTED });
  for (const f of site.openFindings) l.text(f.text, { color: f.severity === "critical" ? DANGER : f.severity === "major" ? CAUTION : undefined, gap: 2 });

  l.heading("Safety notes");
  l.text(site.safetyNotes || "None recorded in the diary.", { color: site.safetyNotes ? undefined : MUTED });
}
