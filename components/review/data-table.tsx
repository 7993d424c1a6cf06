"use client";

// A dense, server-driven table: sorting and paging are done by the API; TanStack Table renders the
// columns, their visibility and the header sort controls.
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type VisibilityState } from "@tanstack/react-table";
import clsx from "clsx";
import { ArrowDown, ArrowUp, ArrowUpDown } from "lucide-react";

export type SortState = { sort: string; dir: "asc" | "desc" };

export function DataTable<T>({
  columns,
  rows,
  visibility,
  sort,
  onSort,
  rowKey,
  rowClassName,
  testId,
  busy,
}: {
  columns: ColumnDef<T>[];
  rows: T[];
  visibility: VisibilityState;
  sort: SortState;
  onSort: (next: SortState) => void;
  rowKey: (row: T) => string;
  rowClassName?: (row: T) => string | undefined;
  testId: string;
  busy?: boolean;
}) {
  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table is the stack's table; this component is simply not compiler-memoized
  const table = useReactTable({
    data: rows,
    columns,
    state: { columnVisibility: visibility },
    getCoreRowModel: getCoreRowModel(),
    getRowId: rowKey,
    manualSorting: true,
    manualPagination: true,
  });
  return (
    <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
      <table data-testid={testId} aria-busy={busy || undefined} className={clsx("w-full border-collapse text-[13px] leading-snug", busy && "opacity-60")}>
        <thead className="bg-ink-50 text-left text-xs uppercase tracking-wide text-ink-700">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const key = header.column.id;
                const active = sort.sort === key;
                const sortable = header.column.columnDef.enableSorting !== false;
                const Icon = active ? (sort.dir === "asc" ? ArrowUp : ArrowDown) : ArrowUpDown;
                const align = (header.column.columnDef.meta as { align?: string } | undefined)?.align === "right";
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={active ? (sort.dir === "asc" ? "ascending" : "descending") : undefined}
                    className={clsx("whitespace-nowrap border-b border-ink-200 px-1.5 py-2 font-semibold", align && "text-right")}
                  >
                    {sortable ? (
                      <button
                        type="button"
                        data-testid={`sort-${key}`}
                        className={clsx("inline-flex items-center gap-1 hover:text-ink-950", active && "text-ink-950")}
                        onClick={() => onSort({ sort: key, dir: active && sort.dir === "desc" ? "asc" : "desc" })}
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <Icon className={clsx("h-3.5 w-3.5", !active && "opacity-40")} aria-hidden="true" />
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-testid={`${testId}-row`} className={clsx("border-b border-ink-100 hover:bg-lichen-50/50", rowClassName?.(row.original))}>
              {row.getVisibleCells().map((cell) => {
                const meta = cell.column.columnDef.meta as { align?: string; wrap?: boolean } | undefined;
                const align = meta?.align === "right";
                return (
                  <td key={cell.id} data-col={cell.column.id} className={clsx("px-1.5 py-1.5 align-top", meta?.wrap ? "min-w-[10rem] max-w-[15rem]" : "whitespace-nowrap", align && "text-right tabular-nums")}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                );
              })}
            </tr>
          ))}
          {rows.length === 0 ? (
            <tr>
              <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-6 text-center text-muted" data-testid={`${testId}-empty`}>
                {busy ? "Loading…" : "Nothing matches these filters."}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}

export function Pager({ page, pageSize, total, onPage }: { page: number; pageSize: number; total: number; onPage: (page: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  const btn = "rounded-md border border-ink-300 bg-white px-2.5 py-1 text-sm font-semibold hover:bg-ink-50 disabled:opacity-40";
  return (
    <div className="flex items-center gap-2 text-sm" data-testid="pager">
      <span className="text-muted" data-testid="pager-range">
        {first}–{last} of {total.toLocaleString("en-US")}
      </span>
      <button type="button" className={btn} disabled={page <= 1} onClick={() => onPage(1)} aria-label="First page">«</button>
      <button type="button" className={btn} disabled={page <= 1} onClick={() => onPage(page - 1)} data-testid="pager-prev">Previous</button>
      <span>Page {page} of {pages}</span>
      <button type="button" className={btn} disabled={page >= pages} onClick={() => onPage(page + 1)} data-testid="pager-next">Next</button>
      <button type="button" className={btn} disabled={page >= pages} onClick={() => onPage(pages)} aria-label="Last page">»</button>
    </div>
  );
}
