"use client";

// One finding: what does not conform, where, how serious, the requirement, the action and its due
// date; the superintendent's answer; the inspector's close or reopen. The buttons shown are the moves
// lib/site-visits/lifecycle allows this role (the server checks again).
import { calendarDateText } from "@/lib/time/zone";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatDateTime } from "@/components/field/project-time";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { canAddPhotos, RecordPhotos } from "@/components/photos/record-photos";
import type { ProjectRole } from "@/lib/auth/roles";
import type { FindingState } from "@/lib/records/enums";
import { allowedMoves } from "@/lib/site-visits/lifecycle";
import { StateBadge } from "@/components/ui/state-badge";
import { FINDING_MOVE_WORDS } from "@/lib/ui/vocabulary";
import { transitionSiteRecordLocal, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { placementName } from "./visit-model";

const NEEDS_LABEL = { response: "What was done to correct it", reason: "Why it is reopened" } as const;

export function FindingCard({ finding, project, placements = [] }: { finding: LocalRecord<"findings">; project: ProjectRow; placements?: LocalRecord<"placements">[] }) {
  const db = useSyncDb();
  const state = finding.state as FindingState;
  const moves = allowedMoves("findings", state, (project.role ?? null) as ProjectRole | null);
  const [active, setActive] = useState<string | null>(null);
  const [text, setText] = useState("");
  const { error, run } = useDeviceWrite();
  const move = moves.find((m) => m.to === active);

  const submit = (to: string) =>
    run(async () => {
      const m = moves.find((x) => x.to === to);
      const arg = m?.needs === "response" ? { response: text.trim() } : m?.needs === "reason" ? { reason: text.trim() } : { note: text.trim() || undefined };
      await transitionSiteRecordLocal(db, "findings", finding.id, { to, ...arg });
      setActive(null);
      setText("");
    });

  return (
    <li id={`finding-${finding.id}`} className="rounded border border-ink-200 p-3" data-testid="finding">
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-bold text-ink-950">{finding.description}</span>
        <StateBadge kind="finding" code={state} testId="finding-state" />
        <StateBadge kind="finding-severity" code={finding.severity} testId="finding-severity" />
      </div>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {finding.placementId ? (
          <>
            <dt className="text-muted">Placement</dt>
            <dd data-testid="finding-placement-name">
              <Link href={`/field/placement?id=${finding.placementId}`} className="font-semibold text-lichen-800 underline">
                {placementName(placements.find((p) => p.id === finding.placementId))}
              </Link>
            </dd>
          </>
        ) : null}
        <dt className="text-muted">Where</dt>
        <dd>{finding.location || "—"}</dd>
        <dt className="text-muted">Requirement</dt>
        <dd>{finding.requirement || "—"}</dd>
        <dt className="text-muted">Action required</dt>
        <dd>{finding.actionRequired || "—"}</dd>
        <dt className="text-muted">By</dt>
        <dd>{finding.dueDate ? calendarDateText(finding.dueDate) : "—"}</dd>
        {finding.response ? (
          <>
            <dt className="text-muted">Correction</dt>
            <dd data-testid="finding-response">
              {finding.response} <span className="text-muted">({formatDateTime(finding.answeredAt, project.timeZone)})</span>
            </dd>
          </>
        ) : null}
        {finding.reopenReason && state === "open" ? (
          <>
            <dt className="text-muted">Reopened</dt>
            <dd>{finding.reopenReason}</dd>
          </>
        ) : null}
      </dl>
      {/* Evidence: the inspector's photos of the nonconformance, the superintendent's of the fix. */}
      <RecordPhotos projectId={finding.projectId} recordType="findings" recordId={finding.id} canAdd={canAddPhotos(project) && state !== "closed"} title="Finding photos" />
      {moves.length > 0 ? (
        <div className="mt-2 flex flex-wrap gap-2">
          {moves.map((m) => (
            <Button key={m.to} variant={m.to === "open" ? "secondary" : "primary"} data-testid={`finding-${m.verb}`} onClick={() => (m.needs || m.to === "closed" ? setActive(m.to) : void submit(m.to))}>
              {FINDING_MOVE_WORDS[m.to as FindingState].button}
            </Button>
          ))}
        </div>
      ) : null}
      {active ? (
        <form
          className="mt-2 flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            void submit(active);
          }}
        >
          <Field label={move?.needs ? NEEDS_LABEL[move.needs] : "Note from the re-inspection (optional)"} value={text} onChange={(e) => setText(e.target.value)} data-testid="finding-move-text" />
          <div className="flex gap-2">
            <Button type="submit" disabled={Boolean(move?.needs) && !text.trim()} data-testid="finding-move-save">
              Save
            </Button>
            <Button variant="secondary" onClick={() => setActive(null)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : null}
      {error ? (
        <Notice tone="danger" title="Not changed" className="mt-2">
          {error}
        </Notice>
      ) : null}
    </li>
  );
}
