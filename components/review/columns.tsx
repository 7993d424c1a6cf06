"use client";

// Column definitions of the two review tables, in each row's project units.
import type { ColumnDef } from "@tanstack/react-table";
import clsx from "clsx";
import Link from "next/link";
import { formatEvaporation, formatVolume, formatWaterVolume } from "@/lib/concrete/units";
import { StateBadge } from "@/components/ui/state-badge";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS, PLACEMENT_MEASURES } from "@/lib/review/columns";
import { DELIVERY_STATUS_WORDS, SEVERITY_WORDS, TONES, textClassOf } from "@/lib/ui/vocabulary";
import type { DiaryReviewRow, PlacementReviewRow } from "@/lib/review/query-schemas";

const label = (cols: readonly { key: string; label: string }[], key: string) => cols.find((c) => c.key === key)!.label.replace(/ \((m³|L|min)\)$/, "");
const P = (key: string) => label(PLACEMENT_COLUMNS, key);
const D = (key: string) => label(DIARY_COLUMNS, key);

/** A count that needs attention, in the colour of a warning (the number is the word). */
function Count({ n }: { n: number }) {
  if (n === 0) return <span className="text-ink-400">0</span>;
  return <span className={clsx("rounded border px-1.5 py-0.5 font-semibold", TONES[SEVERITY_WORDS.warning.tone].className)}>{n}</span>;
}

const RISK_TEXT = { low: "Low", caution: "Caution", high: "High" } as const;

export function placementColumns(): ColumnDef<PlacementReviewRow>[] {
  return [
    { id: "date", header: P("date"), cell: ({ row }) => <span className="tabular-nums">{row.original.date}</span> },
    { id: "project", header: P("project"), cell: ({ row }) => <span title={row.original.projectName}>{row.original.projectCode}</span> },
    {
      id: "element",
      header: P("element"),
      meta: { wrap: true },
      cell: ({ row }) => {
        const r = row.original;
        return (
          <Link href={`/projects/${r.projectId}/placements/${r.id}/review`} className="font-semibold text-lichen-800 underline-offset-2 hover:underline" data-testid="placement-link">
            {r.element}
            {r.level ? <span className="ml-1 font-normal text-muted">{r.level}</span> : null}
          </Link>
        );
      },
    },
    { id: "mix", header: P("mix"), cell: ({ row }) => row.original.mixCode ?? <span className="text-ink-400">—</span> },
    { id: "orderedM3", header: "Ordered", meta: { align: "right" }, cell: ({ row }) => (row.original.orderedM3 === null ? "—" : formatVolume(row.original.orderedM3, row.original.unitSystem, PLACEMENT_MEASURES.orderedM3.digits)) },
    { id: "placedM3", header: "Placed", meta: { align: "right" }, cell: ({ row }) => formatVolume(row.original.placedM3, row.original.unitSystem, PLACEMENT_MEASURES.placedM3.digits) },
    {
      id: "trucks",
      header: P("trucks"),
      meta: { align: "right" },
      cell: ({ row }) => (
        <>
          {row.original.trucks}
          {row.original.rejectedTrucks ? <span className={clsx("ml-1 font-semibold", textClassOf("delivery", "rejected"))}>({row.original.rejectedTrucks} {DELIVERY_STATUS_WORDS.rejected.label.toLowerCase()})</span> : null}
        </>
      ),
    },
    { id: "lateTrucks", header: "Late", meta: { align: "right" }, cell: ({ row }) => <Count n={row.original.lateTrucks} /> },
    {
      id: "waterAddedL",
      header: "Water added",
      meta: { align: "right" },
      cell: ({ row }) =>
        row.original.waterLoads === 0 ? <span className="text-ink-400">—</span> : <span className="font-semibold text-caution-800">{formatWaterVolume(row.original.waterAddedL, row.original.unitSystem)}</span>,
    },
    { id: "testsOut", header: P("testsOut"), meta: { align: "right" }, cell: ({ row }) => <Count n={row.original.testsOut} /> },
    {
      id: "evaporationRisk",
      header: "Evaporation",
      cell: ({ row }) => {
        const r = row.original;
        if (!r.evaporationRisk) return <span className="text-ink-400">—</span>;
        return (
          <span className={clsx("font-semibold", r.evaporationRisk === "high" ? "text-danger-700" : r.evaporationRisk === "caution" ? "text-caution-800" : "text-ink-700")}>
            {RISK_TEXT[r.evaporationRisk]}
            {r.maxEvaporationKgM2H !== null ? <span className="ml-1 font-normal text-muted">{formatEvaporation(r.maxEvaporationKgM2H, r.unitSystem, r.unitSystem === "SI" ? 2 : 3)}</span> : null}
          </span>
        );
      },
    },
    {
      id: "state",
      header: P("state"),
      cell: ({ row }) => (
        <span className="inline-flex flex-wrap items-center gap-1">
          <StateBadge kind="placement" code={row.original.state} size="sm" testId="placement-state" />
          {row.original.hasWarnings ? <StateBadge kind="severity" code="warning" size="sm" testId="warned" /> : null}
        </span>
      ),
    },
    { id: "signedBy", header: P("signedBy"), cell: ({ row }) => row.original.signedBy ?? <span className="text-ink-400">—</span> },
  ];
}

export function diaryColumns(): ColumnDef<DiaryReviewRow>[] {
  return [
    {
      id: "date",
      header: D("date"),
      cell: ({ row }) => (
        <Link href={`/projects/${row.original.projectId}/diary/${row.original.date}`} className="font-semibold tabular-nums text-lichen-800 underline-offset-2 hover:underline" data-testid="diary-link">
          {row.original.date}
          <span className="ml-1 font-normal text-muted">{new Date(`${row.original.date}T12:00:00Z`).toLocaleDateString("en-US", { weekday: "short", timeZone: "UTC" })}</span>
        </Link>
      ),
    },
    { id: "project", header: D("project"), cell: ({ row }) => <span title={row.original.projectName}>{row.original.projectName}</span> },
    {
      id: "state",
      header: D("state"),
      cell: ({ row }) => (
        <StateBadge kind="diary" code={row.original.state} size="sm" testId="diary-state" />
      ),
    },
    { id: "placements", header: D("placements"), meta: { align: "right" }, cell: ({ row }) => row.original.placements },
    { id: "crew", header: D("crew"), meta: { align: "right" }, cell: ({ row }) => row.original.crew || <span className="text-ink-400">—</span> },
    { id: "delayMinutes", header: "Delays", meta: { align: "right" }, cell: ({ row }) => (row.original.delayMinutes ? `${row.original.delayMinutes} min` : <span className="text-ink-400">—</span>) },
    { id: "submittedBy", header: D("submittedBy"), cell: ({ row }) => row.original.submittedBy ?? <span className="text-ink-400">—</span> },
  ];
}
