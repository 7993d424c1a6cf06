"use client";

// A held placement says so at the top of its screen, in words, with the inspector's reason, so the
// superintendent sees it before anything else (and before any truck is called).
import { OctagonAlert } from "lucide-react";
import { mayWrite, str } from "@/components/field/common";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";

export function HoldBanner({ placement, project }: { placement: LocalRecord; project: ProjectRow }) {
  if (placement.state !== "held") return null;
  const fixer = mayWrite(project, "placement.markReady");
  return (
    <div role="alert" data-testid="hold-banner" className="flex gap-3 rounded-lg border-2 border-danger-600 bg-danger-50 p-4 text-danger-800">
      <OctagonAlert className="mt-0.5 h-7 w-7 shrink-0" aria-hidden="true" />
      <div className="min-w-0">
        <p className="text-lg font-bold">
          <span className="sr-only">Warning: </span>Held by the inspector. Do not place.
        </p>
        <p className="mt-1 text-base font-semibold text-ink-950" data-testid="hold-reason-text">
          {str(placement.holdReason) || "No reason was given."}
        </p>
        <p className="mt-1 text-sm">
          {fixer
            ? "Fix what is named, update the readiness answers, then mark it ready again for the inspector."
            : "The placement cannot start until the inspector clears it."}
        </p>
      </div>
    </div>
  );
}
