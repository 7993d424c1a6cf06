// Who signed, as what and when, with the drawn signature: shown the same way for a sign-off and
// for a signed amendment. Plain text, never inputs.
import { formatDateTime } from "@/components/field/project-time";
import { ROLE_LABELS, type ProjectRole } from "@/lib/auth/roles";
import type { SignOffRow } from "./use-sign-off";

const roleLabel = (role: string) => ROLE_LABELS[role as ProjectRole] ?? role;

export function SignatureBlock({ signOff, timeZone, testId }: { signOff: SignOffRow; timeZone: string; testId?: string }) {
  return (
    <div className="flex flex-col gap-2 sm:flex-row sm:items-start" data-testid={testId}>
      {signOff.signatureImage ? (
        // eslint-disable-next-line @next/next/no-img-element -- a data URL from the server, not an asset
        <img
          src={signOff.signatureImage}
          alt={`Signature of ${signOff.typedName}`}
          data-testid="signature-image"
          className="h-24 w-full max-w-xs rounded-lg border border-ink-200 bg-white object-contain"
        />
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-base">
        <dt className="text-sm text-muted">Signed by</dt>
        <dd className="font-semibold" data-testid="signer-name">
          {signOff.typedName}
          {signOff.signerName && signOff.signerName !== signOff.typedName ? <span className="font-normal text-muted"> (account: {signOff.signerName})</span> : null}
        </dd>
        <dt className="text-sm text-muted">Role</dt>
        <dd className="font-semibold" data-testid="signer-role">
          {roleLabel(signOff.role)}
        </dd>
        <dt className="text-sm text-muted">Time</dt>
        <dd className="font-semibold">{formatDateTime(signOff.signedAt, timeZone)}</dd>
      </dl>
    </div>
  );
}
