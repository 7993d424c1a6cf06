"use client";

/**
 * A card of the placement screen. `folded`: a finished section (an answered readiness check on a
 * placement past inspection) starts closed under its one-line `summary`, so long pages stay short;
 * a tap opens it.
 */
export function Section({
  title,
  children,
  testId,
  actions,
  folded,
}: {
  title: string;
  children: React.ReactNode;
  testId?: string;
  actions?: React.ReactNode;
  folded?: { summary: string };
}) {
  if (folded) {
    return (
      <section className="card p-4" data-testid={testId} aria-label={title} data-folded="yes">
        <details className="group">
          <summary className="flex min-h-touch cursor-pointer list-none flex-wrap items-center justify-between gap-2" data-testid={testId ? `${testId}-toggle` : undefined}>
            <h2 className="text-xl font-bold text-ink-950">{title}</h2>
            <span className="text-base text-ink-800">
              {folded.summary} <span className="font-semibold text-lichen-800 group-open:hidden">· Show</span>
              <span className="hidden font-semibold text-lichen-800 group-open:inline">· Hide</span>
            </span>
          </summary>
          <div className="mt-3">{children}</div>
        </details>
      </section>
    );
  }
  return (
    <section className="card p-4" data-testid={testId} aria-label={title}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-xl font-bold text-ink-950">{title}</h2>
        {actions}
      </div>
      {children}
    </section>
  );
}
