"use client";

// Column definitions of the two review tables, in each row's project units.
import type { ColumnDef } from "@tanstack/react-table";
import clsx from "clsx";
import Link from "next/link";
import { formatEvaporation, formatVolume, formatWaterVolume } from "@/lib/concrete/units";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS } from "@/lib/review/columns";
import type { DiaryReviewRow, PlacementReviewRow } from "@/lib/review/query";

const label = (cols: readonly { key: string; label: string }[], key: string) => cols.find((c) => c.key === key)!.label.replace(/ \((m³|L|min)\)$/, "");
const P = (key: string) => label(PLACEMENT_COLUMNS, key);
const D = (key: string) => label(DIARY_COLUMNS, key);

export const STATE_TEXT: Record<PlacementReviewRow["state"], string> = {
  planned: "Planned",
  ready: "Ready",
  cleared: "Cleared",
  placing: "Placing",
  placed: "Placed",
  signed: "Signed",
  held: "Held",
};

function Count({ n, tone }: { n: number; tone: "danger" | "caution" }) {
  if (n === 0) return <span className="text-ink-400">0</span>;
  return <span className={clsx("rounded px-1.5 py-0.5 font-semibold", tone === "danger" ? "bg-danger-100 text-danger-800" : "bg-caution-100 text-caution-800")}>{n}</span>;
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
    { id: "orderedM3", header: "Ordered", meta: { align: "right" }, cell: ({ row }) => (row.original.orderedM3 === null ? "—" : formatVolume(row.original.orderedM3, row.original.unitSystem, 1)) },
    { id: "placedM3", header: "Placed", meta: { align: "right" }, cell: ({ row }) => formatVolume(row.original.placedM3, row.original.unitSystem, 1) },
    {
      id: "trucks",
      header: P("trucks"),
      meta: { align: "right" },
      cell: ({ row }) => (
        <>
          {row.original.trucks}
          {row.original.rejectedTrucks ? <span className="ml-1 text-danger-700">({row.original.rejectedTrucks} rejected)</span> : null}
        </>
      ),
    },
    { id: "lateTrucks", header: "Late", meta: { align: "right" }, cell: ({ row }) => <Count n={row.original.lateTrucks} tone="danger" /> },
    {
      id: "waterAddedL",
      header: "Water added",
      meta: { align: "right" },
      cell: ({ row }) =>
        row.original.waterLoads === 0 ? <span className="text-ink-400">—</span> : <span className="font-semibold text-caution-800">{formatWaterVolume(row.original.waterAddedL, row.original.unitSystem)}</span>,
    },
    { id: "testsOut", header: "Tests out", meta: { align: "right" }, cell: ({ row }) => <Count n={row.original.testsOut} tone="danger" /> },
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
        <span className="inline-flex items-center gap-1">
          {STATE_TEXT[row.original.state]}
          {row.original.hasWarnings ? (
            <span className="rounded bg-danger-100 px-1 text-xs font-bold text-danger-800" data-testid="warned" title="Has warnings">
              Warnings
            </span>
          ) : null}
        </span>
      ),
    },
    { id: "signedBy", header: P("signedBy"), cell: ({ row }) => row.original.signedBy ?? <span className="text-ink-400">—</span> },
  ];
}

const DIARY_STATE = { missing: "Missing", draft: "Draft", submitted: "Submitted" } as const;

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
        <span className={clsx("rounded px-1.5 py-0.5 text-xs font-bold", row.original.state === "missing" ? "bg-danger-100 text-danger-800" : row.original.state === "draft" ? "bg-caution-100 text-caution-800" : "bg-lichen-50 text-lichen-900")}>
          {DIARY_STATE[row.original.state]}
        </span>
      ),
    },
    { id: "placements", header: D("placements"), meta: { align: "right" }, cell: ({ row }) => row.original.placements },
    { id: "crew", header: D("crew"), meta: { align: "right" }, cell: ({ row }) => row.original.crew || <span className="text-ink-400">—</span> },
    { id: "delayMinutes", header: "Delays", meta: { align: "right" }, cell: ({ row }) => (row.original.delayMinutes ? `${row.original.delayMinutes} min` : <span className="text-ink-400">—</span>) },
    { id: "submittedBy", header: D("submittedBy"), cell: ({ row }) => row.original.submittedBy ?? <span className="text-ink-400">—</span> },
  ];
}
