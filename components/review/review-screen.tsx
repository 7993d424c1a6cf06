"use client";

// The office review screen: placements or diaries across the user's projects, filtered, sorted
// and paged by the API (TanStack Query), with a column chooser, a CSV of the current view and a
// saved default view per user.
import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import clsx from "clsx";
import { Download, Save } from "lucide-react";
import { useMemo, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { callApi } from "@/lib/api/client";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS } from "@/lib/review/columns";
import { DIARY_STATES, REVIEW_PAGE_SIZES, type DiaryReviewRow, type PlacementReviewRow, type ReviewPage } from "@/lib/review/query-schemas";
import type { ReviewView, SavedViews } from "@/lib/review/view-schema";
import { diaryColumns, placementColumns } from "./columns";
import { placementStateLabel, wordFor } from "@/lib/ui/vocabulary";
import { CheckMenu, SmallDate, SmallSelect, smallButton } from "./controls";
import { DataTable, Pager } from "./data-table";

export type ReviewProject = { id: string; name: string; code: string };
type List = "placements" | "diaries";

type ViewState = {
  columns: string[];
  sort: string;
  dir: "asc" | "desc";
  pageSize: number;
  filters: { projects: string[]; from: string; to: string; state: string[]; hasWarnings: "" | "1" | "0" };
};

const DEFAULTS: Record<List, ViewState> = {
  placements: { columns: PLACEMENT_COLUMNS.map((c) => c.key), sort: "date", dir: "desc", pageSize: 50, filters: { projects: [], from: "", to: "", state: [], hasWarnings: "" } },
  diaries: { columns: DIARY_COLUMNS.map((c) => c.key), sort: "date", dir: "desc", pageSize: 50, filters: { projects: [], from: "", to: "", state: [], hasWarnings: "" } },
};

function fromSaved(list: List, saved: SavedViews[List]): ViewState {
  if (!saved) return DEFAULTS[list];
  const f = saved.filters as { projects?: string[]; from?: string; to?: string; state?: string[]; hasWarnings?: boolean };
  return {
    columns: saved.columns,
    sort: saved.sort,
    dir: saved.dir,
    pageSize: saved.pageSize,
    filters: { projects: f.projects ?? [], from: f.from ?? "", to: f.to ?? "", state: f.state ?? [], hasWarnings: f.hasWarnings === undefined ? "" : f.hasWarnings ? "1" : "0" },
  };
}

function toSaved(list: List, v: ViewState): ReviewView {
  const filters: Record<string, unknown> = {};
  if (v.filters.projects.length) filters.projects = v.filters.projects;
  if (v.filters.from) filters.from = v.filters.from;
  if (v.filters.to) filters.to = v.filters.to;
  if (v.filters.state.length) filters.state = v.filters.state;
  if (list === "placements" && v.filters.hasWarnings) filters.hasWarnings = v.filters.hasWarnings === "1";
  return { list, columns: v.columns, sort: v.sort, dir: v.dir, pageSize: v.pageSize, filters } as ReviewView;
}

function queryString(list: List, v: ViewState, page: number, extra: Record<string, string> = {}) {
  const q = new URLSearchParams({ sort: v.sort, dir: v.dir, page: String(page), pageSize: String(v.pageSize), ...extra });
  if (v.filters.projects.length) q.set("projects", v.filters.projects.join(","));
  if (v.filters.from) q.set("from", v.filters.from);
  if (v.filters.to) q.set("to", v.filters.to);
  if (v.filters.state.length) q.set("state", v.filters.state.join(","));
  if (list === "placements" && v.filters.hasWarnings) q.set("hasWarnings", v.filters.hasWarnings);
  return q.toString();
}

export function ReviewScreen({ projects, saved, initialList = "placements" }: { projects: ReviewProject[]; saved: SavedViews; initialList?: List }) {
  const [list, setList] = useState<List>(initialList);
  const tab = (which: List, text: string) => (
    <button
      type="button"
      role="tab"
      aria-selected={list === which}
      data-testid={`tab-${which}`}
      onClick={() => setList(which)}
      className={clsx("rounded-t-md border-b-2 px-4 py-2 text-sm font-semibold", list === which ? "border-lichen-700 text-ink-950" : "border-transparent text-ink-600 hover:text-ink-900")}
    >
      {text}
    </button>
  );
  return (
    <div>
      <div role="tablist" aria-label="Review lists" className="mb-3 flex gap-1 border-b border-ink-200">
        {tab("placements", "Placements")}
        {tab("diaries", "Daily diaries")}
      </div>
      {/* Both lists stay mounted so switching keeps each one's filters and page. */}
      <div hidden={list !== "placements"}>
        <ReviewList list="placements" projects={projects} initial={fromSaved("placements", saved.placements)} />
      </div>
      <div hidden={list !== "diaries"}>
        <ReviewList list="diaries" projects={projects} initial={fromSaved("diaries", saved.diaries)} />
      </div>
    </div>
  );
}

function ReviewList({ list, projects, initial }: { list: List; projects: ReviewProject[]; initial: ViewState }) {
  const [view, setView] = useState<ViewState>(initial);
  const [page, setPage] = useState(1);
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const queryClient = useQueryClient();
  const qs = queryString(list, view, page);
  const query = useQuery({
    queryKey: ["review", list, qs],
    queryFn: async () => {
      const res = await callApi<ReviewPage<PlacementReviewRow | DiaryReviewRow>>(`/api/review/${list}?${qs}`);
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
    placeholderData: keepPreviousData,
  });
  const save = useMutation({
    mutationFn: async () => {
      const res = await callApi<SavedViews>("/api/review/views", { method: "PUT", body: toSaved(list, view) });
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
    onSuccess: () => {
      setMessage({ tone: "success", text: "Saved as your default view." });
      queryClient.invalidateQueries({ queryKey: ["review-views"] });
    },
    onError: (e) => setMessage({ tone: "danger", text: e.message }),
  });

  const all = list === "placements" ? PLACEMENT_COLUMNS : DIARY_COLUMNS;
  const columns = useMemo(() => (list === "placements" ? placementColumns() : diaryColumns()), [list]);
  const visibility = Object.fromEntries(all.map((c) => [c.key, view.columns.includes(c.key)]));
  const update = (patch: Partial<ViewState>) => {
    setView((v) => ({ ...v, ...patch }));
    setPage(1);
    setMessage(null);
  };
  const filter = (patch: Partial<ViewState["filters"]>) => update({ filters: { ...view.filters, ...patch } });
  const csvHref = `/api/review/${list}?${queryString(list, view, 1, { format: "csv", columns: all.filter((c) => view.columns.includes(c.key)).map((c) => c.key).join(",") })}`;
  const stateOptions =
    list === "placements"
      ? PLACEMENT_STATES.map((s) => ({ value: s, label: placementStateLabel(s) }))
      : DIARY_STATES.map((s) => ({ value: s, label: wordFor("diary", s).label }));
  const data = query.data;

  return (
    <section aria-label={list === "placements" ? "Placements" : "Daily diaries"} data-testid={`review-${list}`}>
      <div className="mb-2 flex flex-wrap items-end gap-3">
        <CheckMenu label="Projects" testId={`${list}-filter-projects`} options={projects.map((p) => ({ value: p.id, label: `${p.code} · ${p.name}` }))} selected={view.filters.projects} onChange={(projects) => filter({ projects })} emptyText="All my projects" />
        <SmallDate label="From" testId={`${list}-filter-from`} value={view.filters.from} onChange={(from) => filter({ from })} />
        <SmallDate label="To" testId={`${list}-filter-to`} value={view.filters.to} onChange={(to) => filter({ to })} />
        <CheckMenu label={list === "placements" ? "State" : "Diary"} testId={`${list}-filter-state`} options={stateOptions} selected={view.filters.state} onChange={(state) => filter({ state })} emptyText="Any" />
        {list === "placements" ? (
          <SmallSelect
            label="Warnings"
            testId="placements-filter-warnings"
            value={view.filters.hasWarnings}
            onChange={(v) => filter({ hasWarnings: v as ViewState["filters"]["hasWarnings"] })}
            options={[
              { value: "", label: "Any" },
              { value: "1", label: "Has warnings" },
              { value: "0", label: "No warnings" },
            ]}
          />
        ) : null}
        <CheckMenu label="Columns" testId={`${list}-columns`} options={all.map((c) => ({ value: c.key, label: c.label }))} selected={view.columns} onChange={(cols) => cols.length && update({ columns: all.map((c) => c.key).filter((k) => cols.includes(k)) })} />
        <SmallSelect label="Rows" testId={`${list}-page-size`} value={String(view.pageSize)} onChange={(v) => update({ pageSize: Number(v) })} options={REVIEW_PAGE_SIZES.map((n) => ({ value: String(n), label: `${n} a page` }))} />
        <div className="ml-auto flex flex-wrap items-end gap-2">
          <a href={csvHref} className={smallButton()} data-testid={`${list}-csv`} download title="In each project's units, rounded as on screen">
            <Download className="h-4 w-4" aria-hidden="true" /> CSV
          </a>
          {list === "placements" ? (
            <a href={`${csvHref}&units=si`} className={smallButton()} data-testid={`${list}-csv-si`} download title="Stored SI values, unrounded">
              CSV (SI, raw)
            </a>
          ) : null}
          <button type="button" className={smallButton("primary")} data-testid={`${list}-save-view`} disabled={save.isPending} onClick={() => save.mutate()}>
            <Save className="h-4 w-4" aria-hidden="true" /> Save as my default view
          </button>
        </div>
      </div>
      {message ? <p className={clsx("mb-2 text-sm font-semibold", message.tone === "success" ? "text-lichen-800" : "text-danger-700")} role="status">{message.text}</p> : null}
      {query.isError ? (
        <Notice tone="danger" title="The list could not be loaded." className="mb-2">
          {query.error.message}
        </Notice>
      ) : null}
      <DataTable
        columns={columns as never}
        rows={(data?.rows ?? []) as never[]}
        visibility={visibility}
        sort={{ sort: view.sort, dir: view.dir }}
        onSort={(s) => update({ sort: s.sort, dir: s.dir })}
        rowKey={(r: PlacementReviewRow | DiaryReviewRow) => ("id" in r ? r.id : `${r.projectId}:${r.date}`)}
        rowClassName={(r: PlacementReviewRow | DiaryReviewRow) => ("hasWarnings" in r && r.hasWarnings ? "bg-danger-50/40" : "state" in r && r.state === "missing" ? "bg-danger-50/30" : undefined)}
        testId={`${list}-table`}
        busy={query.isFetching}
      />
      <div className="mt-2 flex flex-wrap items-center justify-between gap-2">
        <p className="text-xs text-muted">
          {list === "placements"
            ? "Late trucks, tests out of tolerance, water and evaporation apply the digest's rules (ASTM C94, ACI 305R) with the project's limits; the project specification governs."
            : "Work days are weekdays, and any day with a placement or a diary. Future days are not listed."}
        </p>
        {data ? <Pager page={page} pageSize={view.pageSize} total={data.total} onPage={setPage} /> : null}
      </div>
    </section>
  );
}
