"use client";

// A held placement says so at the top of its screen, in words, with the inspector's reason, so the
// superintendent sees it before anything else (and before any truck is called).
import clsx from "clsx";
import { mayWrite } from "@/components/field/field-project";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { PLACEMENT_MOVE_WORDS, PLACEMENT_STATE_WORDS, SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";
import { ConcreteInPlace } from "./concrete-in-place";

export function HoldBanner({ placement, project }: { placement: LocalRecord<"placements">; project: ProjectRow }) {
  if (placement.state !== "held") return null;
  const fixer = mayWrite(project, "placement.markReady");
  const held = PLACEMENT_STATE_WORDS.held;
  return (
    <div role="alert" data-testid="hold-banner" data-tone={held.tone} className={clsx("flex gap-3 rounded-lg border-2 p-4", TONES[held.tone].className)}>
      <VocabularyIcon name={held.icon} className="mt-0.5 h-7 w-7 shrink-0" />
      <div className="min-w-0">
        <p className="text-lg font-bold">
          <span className="sr-only">{SEVERITY_WORDS.warning.label}: </span>
          {held.label} by the inspector. Do not place.
        </p>
        <p className="mt-1 text-base font-semibold text-ink-950" data-testid="hold-reason-text">
          {(placement.holdReason ?? "") || "No reason was given."}
        </p>
        <ConcreteInPlace placement={placement} project={project} />
        <p className="mt-1 text-sm">
          {fixer
            ? `Fix what is named, update the readiness answers, then press “${PLACEMENT_MOVE_WORDS.ready.button}” again.`
            : "The placement cannot start until the inspector clears it."}
        </p>
      </div>
    </div>
  );
}
