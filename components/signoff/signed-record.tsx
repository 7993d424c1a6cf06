"use client";

// A signed placement: the signature, who signed as what and when, the signature check code and whether the
// record still matches it (recomputed by the server now), the amendments beside the original, and
// the late edits this device made that were kept as conflicts rather than applied.
import { useLiveQuery } from "dexie-react-hooks";
import { FilePenLine, Printer, ShieldAlert, ShieldCheck, WifiOff } from "lucide-react";
import { useState } from "react";
import { mayWrite } from "@/components/field/field-project";
import { formatDateTime } from "@/components/field/project-time";
import { Section } from "@/components/field/section";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useOnline, useSyncDb } from "@/lib/sync/client/react";
import { AmendmentCard, AmendmentForm } from "./amendments";
import { SignatureBlock } from "./signature-block";
import { useVerification } from "./use-sign-off";

function HashLine({ hash, matches }: { hash: string; matches: boolean }) {
  return (
    <div className="mt-3 flex flex-col gap-2">
      <p className="text-sm text-muted">
        Signature check code (SHA-256 of the record at signing): <code className="break-all font-mono text-ink-900" data-testid="content-hash">{hash}</code>
      </p>
      {matches ? (
        <Notice tone="success" title="Verified: the record matches what was signed" testId="verify-result">
          The signature check code was recomputed from the stored record just now.
        </Notice>
      ) : (
        <Notice tone="danger" title="Does not match: the record changed after signing" testId="verify-result">
          The signature check code recomputed now differs from the one signed. Report this to the office: a stored row was changed outside the application.
        </Notice>
      )}
    </div>
  );
}

/** Late edits this device made to records of the signed placement: kept by the server, not applied. */
function LateEdits({ placement }: { placement: LocalRecord<"placements"> }) {
  const db = useSyncDb();
  const edits = useLiveQuery(async () => {
    const children = await Promise.all(
      (["deliveries", "field-tests", "specimen-sets", "weather-observations", "checklists", "curing-readings"] as const).map((t) => listByParent(db, t, "placementId", placement.id)),
    );
    const items = await Promise.all(children[4].map((c) => listByParent(db, "checklist-items", "checklistId", c.id)));
    const ids = new Set([placement.id, ...children.flat().map((r) => r.id), ...items.flat().map((r) => r.id)]);
    return db.conflicts.filter((c) => ids.has(c.recordId)).toArray();
  }, [db, placement.id]);
  if (!edits?.length) return null;
  return (
    <Notice tone="caution" title={`${edits.length} late ${edits.length === 1 ? "edit" : "edits"} kept, not applied`} className="mt-3" testId="late-edits">
      Changes made on this device after the sign-off were refused and kept for the office. Add an amendment if they matter; see To reconcile for the values.
    </Notice>
  );
}

/** The signed placement's sign-off, verification and amendments. `project` is the member's own role. */
export function SignedRecord({ placement, project }: { placement: LocalRecord<"placements">; project: ProjectRow }) {
  const online = useOnline();
  const verification = useVerification(project.id, placement.id, online);
  const [adding, setAdding] = useState(false);
  const data = verification.data;
  const canAmend = mayWrite(project, "amendment.write");
  return (
    <Section
      title="Signed record"
      testId="signed-record"
      actions={
        <a href={`/projects/${project.id}/placements/${placement.id}/print`} className="no-print inline-flex min-h-touch items-center gap-2 rounded-lg border border-ink-300 bg-white px-4 font-semibold text-ink-900 hover:bg-ink-50" data-testid="print-link">
          <Printer className="h-5 w-5" aria-hidden="true" /> Print view
        </a>
      }
    >
      <p className="flex items-center gap-2 text-base text-ink-900" data-testid="signed-readonly">
        <ShieldCheck className="h-5 w-5 text-lichen-700" aria-hidden="true" />
        Signed {formatDateTime(placement.signedAt, project.timeZone)}. This record is read-only for everyone; changes are amendments shown beside it.
      </p>
      {!online ? (
        <Notice tone="info" title="No connection" className="mt-3" testId="signed-offline">
          <span className="inline-flex items-center gap-1">
            <WifiOff className="h-4 w-4" aria-hidden="true" /> The signature, its verification and the amendments are read from the server; they show when you are online.
          </span>
        </Notice>
      ) : verification.isPending ? (
        <p className="mt-3 text-muted">Reading the signature from the server…</p>
      ) : verification.isError ? (
        <Notice tone="danger" title="Could not read the signature" className="mt-3">
          {verification.error.message}
        </Notice>
      ) : data && data.signed ? (
        <div className="mt-3 grid gap-4 lg:grid-cols-2">
          <div data-testid="original-sign-off">
            <h3 className="mb-2 text-lg font-bold">Original sign-off</h3>
            <SignatureBlock signOff={data.signOff} timeZone={project.timeZone} testId="sign-off-block" />
            <HashLine hash={data.signOff.contentHash} matches={data.matches} />
          </div>
          <div data-testid="amendments">
            <h3 className="mb-2 flex items-center gap-2 text-lg font-bold">
              Amendments <span className="text-sm font-normal text-muted">({data.amendments.length})</span>
            </h3>
            {data.amendments.length === 0 ? <p className="text-muted">None. The original stands as signed.</p> : null}
            <ol className="flex flex-col gap-2">
              {data.amendments.map((a) => (
                <AmendmentCard key={a.id} amendment={a} project={project} placementId={placement.id} />
              ))}
            </ol>
            {canAmend && !adding ? (
              <Button variant="secondary" className="mt-3" data-testid="add-amendment" onClick={() => setAdding(true)}>
                <FilePenLine className="h-5 w-5" aria-hidden="true" /> Add an amendment
              </Button>
            ) : null}
            {adding ? <AmendmentForm project={project} placementId={placement.id} onDone={() => setAdding(false)} /> : null}
          </div>
        </div>
      ) : (
        <Notice tone="caution" title="No signature found on the server" className="mt-3">
          <span className="inline-flex items-center gap-1">
            <ShieldAlert className="h-4 w-4" aria-hidden="true" /> The placement is marked signed but the server holds no sign-off for it.
          </span>
        </Notice>
      )}
      <LateEdits placement={placement} />
    </Section>
  );
}
