// What the rulebook (lib/checks) says about one truck, drawn under the truck and in its form.
import { FindingNotice } from "@/components/findings/finding-notice";
import { GOVERNS, toCheckProject, type Finding } from "@/lib/checks";
import type { ProjectRow } from "@/lib/sync/client";
import { Verdict } from "./verdict-badges";

type Times = { batchedAt: string | null; dischargeFinishedAt: string | null; status: string };

/**
 * What the rulebook says about a truck: late discharge, the minutes elapsed while it still discharges
 * (no verdict until the discharge ends), revolutions and water added at site. A finished discharge with
 * no finding is in time; that is shown with the minutes and the project's limit.
 */
export function DeliveryChecks({ found, times, project, testId }: { found: Finding[]; times: Times; project: ProjectRow; testId?: string }) {
  const discharge = found.filter((f) => f.rule === "discharge-time" || f.rule === "discharge-elapsed");
  const others = found.filter((f) => !discharge.includes(f));
  const minutes = times.batchedAt && times.dischargeFinishedAt ? Math.round((Date.parse(times.dischargeFinishedAt) - Date.parse(times.batchedAt)) / 60_000) : null;
  const inTime = discharge.length === 0 && times.status !== "rejected" && minutes !== null && minutes >= 0;
  if (!inTime && found.length === 0) return null;
  return (
    <div className="flex flex-col gap-2" data-testid={testId}>
      {discharge.length > 0 || inTime ? (
        <div className="flex flex-col gap-2 text-sm" data-testid="discharge-check">
          {discharge.map((f) => (
            <FindingNotice key={f.rule} finding={f} compact={f.severity === "info"} testId={f.rule === "discharge-elapsed" ? "discharge-elapsed" : "discharge-late"} />
          ))}
          {inTime ? (
            <p className="flex flex-wrap items-center gap-2" data-testid="discharge-in-time">
              <Verdict ok okText="Discharge in time" />
              <span>
                {minutes} min from batching, within the {toCheckProject(project).dischargeLimitMinutes} min limit (ASTM C94 §10.7 unless the project specification sets
                another). {GOVERNS}
              </span>
            </p>
          ) : null}
        </div>
      ) : null}
      {others.map((f) => (
        <FindingNotice key={f.rule} finding={f} compact={f.severity !== "warning"} testId={f.rule === "site-water" ? "water-check" : "delivery-finding"} />
      ))}
    </div>
  );
}
