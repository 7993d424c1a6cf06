// One place that draws a rulebook finding (lib/checks) on a screen: its level in words, the title, what
// to do, the rule it comes from and who governs. The vocabulary module will replace the local look
// below; every screen goes through this component, so that switch happens here only.
import clsx from "clsx";
import { CircleAlert, Info, OctagonAlert } from "lucide-react";
import type { Finding, Severity, Source } from "@/lib/checks";

const LOOK: Record<Severity, { word: string; icon: typeof Info; box: string; chip: string }> = {
  info: { word: "Note", icon: Info, box: "border-ink-300 bg-white text-ink-900", chip: "bg-ink-100 text-ink-800" },
  caution: { word: "Caution", icon: CircleAlert, box: "border-caution-600 bg-caution-50 text-caution-800", chip: "bg-caution-100 text-caution-800" },
  warning: { word: "Warning", icon: OctagonAlert, box: "border-danger-600 bg-danger-50 text-danger-800", chip: "bg-danger-50 text-danger-800" },
};

/** The rule a finding comes from, in one line: "ACI 305R Fig. 2.1.5", "ASTM C94-17a §6.1.9" … */
export function sourceLine(source: Source): string {
  const name = [source.edition ? `${source.document}-${source.edition}` : source.document, source.clause].filter(Boolean).join(" ");
  switch (source.basis) {
    case "product":
      return `${name}: this product's own choice, not a published limit`;
    case "memory":
      return `${name} [memory: recalled, not checked against the published text]`;
    case "practice":
      return `${name} [common practice]`;
    default:
      return name;
  }
}

/** The level of a finding as a small chip: icon and word, never colour alone. */
export function SeverityChip({ severity, testId }: { severity: Severity; testId?: string }) {
  const { word, icon: Icon, chip } = LOOK[severity];
  return (
    <span data-testid={testId} data-severity={severity} className={clsx("inline-flex items-center gap-1 rounded-full px-2 py-0.5 text-sm font-semibold", chip)}>
      <Icon className="h-4 w-4" aria-hidden="true" />
      {word}
    </span>
  );
}

/**
 * A finding in full (title, message, rule, governs) or, `compact`, its title with the rule and who
 * governs, the message folded away.
 */
export function FindingNotice({ finding, compact = false, className, testId = "finding" }: { finding: Finding; compact?: boolean; className?: string; testId?: string }) {
  const { word, icon: Icon, box } = LOOK[finding.severity];
  return (
    <div
      role={finding.severity === "info" ? "status" : "alert"}
      data-testid={testId}
      data-rule={finding.rule}
      data-severity={finding.severity}
      className={clsx("flex gap-3 rounded-lg border-2 p-3", box, className)}
    >
      <Icon className="mt-0.5 h-5 w-5 shrink-0" aria-hidden="true" />
      <div className="min-w-0">
        <p className="font-semibold" data-testid="finding-title">
          <span>{word}: </span>
          {finding.title}
        </p>
        {compact ? (
          <details className="mt-1 text-sm">
            <summary className="cursor-pointer font-semibold">What the rule says</summary>
            <p className="mt-1">{finding.message}</p>
          </details>
        ) : (
          <p className="mt-1 text-sm" data-testid="finding-message">
            {finding.message}
          </p>
        )}
        <p className="mt-1 text-sm" data-testid="finding-source">
          <span className="font-semibold">Rule:</span> {sourceLine(finding.source)}
        </p>
        <p className="mt-0.5 text-xs" data-testid="finding-governs">
          {finding.governs}
        </p>
      </div>
    </div>
  );
}

/** Several findings, most severe first as given. */
export function FindingList({ findings, compact, className, testId }: { findings: Finding[]; compact?: boolean; className?: string; testId?: string }) {
  if (findings.length === 0) return null;
  return (
    <div className={clsx("flex flex-col gap-2", className)} data-testid={testId}>
      {findings.map((f) => (
        <FindingNotice key={`${f.rule}:${f.subject.type}:${f.subject.id}`} finding={f} compact={compact} />
      ))}
    </div>
  );
}

/** A finding in a list row (Today): its level and short name, the rule and who governs in small print. */
export function FindingBadge({ finding, testId = "finding-badge" }: { finding: Finding; testId?: string }) {
  const { icon: Icon, chip } = LOOK[finding.severity];
  return (
    <span className="flex flex-col gap-0.5" data-testid={testId} data-rule={finding.rule} data-severity={finding.severity}>
      <span className={clsx("inline-flex w-fit items-center gap-1 rounded-full px-2 py-0.5 text-sm font-semibold", chip)} title={finding.title}>
        <Icon className="h-4 w-4" aria-hidden="true" />
        {finding.title.split(":")[0]}
      </span>
      <span className="text-xs text-ink-700">
        Rule: {sourceLine(finding.source)}. {finding.governs}
      </span>
    </span>
  );
}
