"use client";

// The warnings the signer must acknowledge, one checkbox each, as the server judges the placement
// (GET …/placements/<id>/findings, the rulebook of lib/checks). Signing is online only, so the
// server's list is the one shown; the server checks the same list again when the signature arrives.
import { useQuery } from "@tanstack/react-query";
import { FindingNotice } from "@/components/findings/finding-notice";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { GOVERNS, findingKey, type Finding } from "@/lib/checks";

export const findingsUrl = (projectId: string, placementId: string) => `/api/projects/${projectId}/placements/${placementId}/findings`;

export function usePlacementWarnings(projectId: string, placementId: string, enabled: boolean) {
  return useQuery({
    queryKey: ["placement-findings", projectId, placementId],
    enabled,
    staleTime: 0,
    queryFn: async () => {
      const res = await callApi<{ findings: Finding[] }>(findingsUrl(projectId, placementId));
      if (!res.ok) throw new Error(res.error.message);
      return res.data.findings;
    },
  });
}

/** Keys of the findings not yet acknowledged; null while the list is loading or failed. */
export const unacknowledged = (findings: Finding[] | undefined, checked: Set<string>): string[] | null =>
  findings ? findings.map(findingKey).filter((k) => !checked.has(k)) : null;

export function AcknowledgeFindings({
  findings,
  error,
  checked,
  onToggle,
}: {
  findings: Finding[] | undefined;
  error: string | null;
  checked: Set<string>;
  onToggle: (key: string, on: boolean) => void;
}) {
  if (error) {
    return (
      <Notice tone="danger" title="Could not load the warnings" testId="acknowledge-error">
        {error} Close and open the sign-off again.
      </Notice>
    );
  }
  if (!findings) return <p className="text-muted">Loading the rulebook&apos;s findings…</p>;
  if (findings.length === 0) {
    return (
      <p className="text-base text-ink-900" data-testid="acknowledge-none">
        The rulebook raises no caution or warning on this placement.
      </p>
    );
  }
  return (
    <fieldset className="flex flex-col gap-3" data-testid="acknowledge-findings">
      <legend className="mb-1 text-base font-bold text-ink-950">
        Acknowledge each of these {findings.length === 1 ? "finding" : `${findings.length} findings`} to sign
      </legend>
      {findings.map((f) => {
        const key = findingKey(f);
        return (
          <div key={key} className="flex flex-col gap-1" data-testid="acknowledge-item" data-rule={f.rule}>
            <FindingNotice finding={f} compact testId="acknowledge-finding" />
            <label className="flex min-h-12 cursor-pointer items-center gap-3 px-1 text-base text-ink-900">
              <input
                type="checkbox"
                className="h-6 w-6 shrink-0 accent-ink-900"
                checked={checked.has(key)}
                onChange={(e) => onToggle(key, e.target.checked)}
                data-testid="acknowledge-check"
              />
              I have read this and sign with it on the record
            </label>
          </div>
        );
      })}
      <p className="text-sm text-ink-700">{GOVERNS}</p>
    </fieldset>
  );
}
