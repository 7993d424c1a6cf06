"use client";

// Two questions the truck form asks before it saves: why concrete goes onto a placement the inspector
// has not cleared, and whether a load the rulebook flags (late, over-watered, wrong mix) is accepted
// or rejected. Both answers are the person's; the rulebook (lib/checks) only names what it found.
import { FindingList } from "@/components/findings/finding-notice";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { StateBadge } from "@/components/ui/state-badge";
import type { Finding } from "@/lib/checks";
import type { LocalRecord } from "@/lib/sync/client";
import { DELIVERY_STATUS_WORDS, PLACEMENT_MOVE_WORDS } from "@/lib/ui/vocabulary";

export function NotClearedQuestion({ placement, input, error }: { placement: LocalRecord<"placements">; input: React.InputHTMLAttributes<HTMLInputElement>; error?: string }) {
  const state = placement.state;
  return (
    <Notice tone="caution" title="This placement is not cleared to place" className="sm:col-span-2" testId="delivery-not-cleared">
      <p className="flex flex-wrap items-center gap-2">
        <span>Its state:</span>
        <StateBadge kind="placement" code={state} testId="delivery-placement-state" />
      </p>
      <p className="mt-1">Concrete goes on once the inspector has pressed “{PLACEMENT_MOVE_WORDS.cleared.button}”.</p>
      <Field
        label="Why is this truck going on now?"
        className="mt-2"
        hint="Kept with the truck and in the audit trail"
        error={error}
        data-testid="delivery-not-cleared-reason"
        {...input}
      />
    </Notice>
  );
}

export function AcceptOrReject({ findings, onAccept, onReject }: { findings: Finding[]; onAccept: () => void; onReject: () => void }) {
  return (
    <div className="flex flex-col gap-2 rounded-lg border-2 border-ink-300 p-3 sm:col-span-2" role="group" aria-label="Accept or reject this load" data-testid="delivery-decision">
      <p className="text-lg font-bold text-ink-950">Accept or reject this load?</p>
      <FindingList findings={findings} testId="delivery-decision-findings" />
      <p className="text-sm">The purchaser decides. Saying which is kept with the truck; a rejected load needs its reason.</p>
      <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
        <Button type="button" data-testid="delivery-decision-accept" onClick={onAccept}>
          {DELIVERY_STATUS_WORDS.accepted.label}: save the load as accepted
        </Button>
        <Button type="button" variant="secondary" data-testid="delivery-decision-reject" onClick={onReject}>
          {DELIVERY_STATUS_WORDS.rejected.label}: give the reason
        </Button>
      </div>
    </div>
  );
}
