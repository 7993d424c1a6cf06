"use client";

// The sign-off section of a placement: the inspector signs a placed placement; once signed,
// everyone sees the signed record. `project` carries the member's own role.
import { FileSignature } from "lucide-react";
import { useState } from "react";
import { mayWrite } from "@/components/field/field-project";
import { Section } from "@/components/field/section";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { LocalRecord, ProjectRow } from "@/lib/sync/client";
import { useRequestSync } from "@/lib/sync/client/react";
import { PlacementSignSummary, blockingReason, usePlacementSummary } from "./placement-summary";
import { usePlacementWarnings } from "./acknowledge-findings";
import { SignOffDialog } from "./lazy-sign-off-dialog";
import { SignedRecord } from "./signed-record";
import { signOffUrl } from "./use-sign-off";

export function PlacementSignOff({ placement, project, mix }: { placement: LocalRecord<"placements">; project: ProjectRow; mix: LocalRecord<"mix-designs"> | null }) {
  const summary = usePlacementSummary(placement, project, mix);
  const requestSync = useRequestSync();
  const [open, setOpen] = useState(false);
  const warnings = usePlacementWarnings(project.id, placement.id, open);
  const [justSigned, setJustSigned] = useState(false);

  if (placement.state === "signed") return <SignedRecord placement={placement} project={project} />;
  if (placement.state !== "placed" || !mayWrite(project, "placement.sign")) return null;
  const version = placement.version ?? 0;
  return (
    <Section title="Sign-off" testId="placement-sign-off">
      {justSigned ? (
        <Notice tone="success" title="Signed" testId="signed-just-now">
          The server has the signature. This device updates with the next sync.
        </Notice>
      ) : (
        <>
          <p className="text-base text-ink-900">
            The placement is placed. Review the record, then sign it: from then on it is frozen, and changes are amendments beside it.
          </p>
          <Button className="mt-3" data-testid="open-sign-off" onClick={() => setOpen(true)}>
            <FileSignature className="h-5 w-5" aria-hidden="true" /> Sign the placement
          </Button>
        </>
      )}
      <SignOffDialog
        open={open}
        endpoint={signOffUrl(project.id, placement.id)}
        baseVersion={version}
        title="Sign the placement"
        summary={<PlacementSignSummary summary={summary} project={project} />}
        acknowledge={{ findings: warnings.data, error: warnings.error ? warnings.error.message : null }}
        blockedReason={version < 1 ? "This placement has not reached the server yet. Sync, then sign." : blockingReason(summary)}
        onClose={() => setOpen(false)}
        onSigned={() => {
          setOpen(false);
          setJustSigned(true);
          requestSync();
        }}
      />
    </Section>
  );
}
