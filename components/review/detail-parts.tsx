// Building blocks of the office detail pages: a titled section and a compact table.
import clsx from "clsx";
import { TONES, type Tone } from "@/lib/ui/vocabulary";

export function Section({ title, count, children, testId, actions }: { title: string; count?: number; children: React.ReactNode; testId?: string; actions?: React.ReactNode }) {
  return (
    <section className="rounded-lg border border-ink-200 bg-white p-3" data-testid={testId}>
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 className="text-base font-bold text-ink-950">
          {title}
          {count !== undefined ? <span className="ml-1.5 text-sm font-normal text-muted">({count})</span> : null}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

export function Empty({ children }: { children: React.ReactNode }) {
  return <p className="text-sm text-muted">{children}</p>;
}

// A row's colour is the background token of its tone (those classes are written out in lib/ui/vocabulary.ts).
export function MiniTable({ head, rows, testId }: { head: string[]; rows: { key: string; cells: React.ReactNode[]; tone?: Tone }[]; testId?: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid={testId}>
        <thead>
          <tr className="border-b border-ink-200 text-left text-xs uppercase tracking-wide text-ink-600">
            {head.map((h) => (
              <th key={h} scope="col" className="whitespace-nowrap px-1.5 py-1 font-semibold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className={clsx("border-b border-ink-100 align-top", r.tone && `bg-${TONES[r.tone].bg}`)}>
              {r.cells.map((c, i) => (
                <td key={i} className={clsx("px-1.5 py-1", i < r.cells.length - 2 && "whitespace-nowrap")}>
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function Facts({ items }: { items: [string, React.ReactNode][] }) {
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
      {items.map(([k, v]) => (
        <div key={k} className="min-w-0">
          <dt className="text-xs font-semibold text-ink-600">{k}</dt>
          <dd className="break-words text-ink-950">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
