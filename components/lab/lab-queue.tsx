"use client";

import { useQuery } from "@tanstack/react-query";
import clsx from "clsx";
import Link from "next/link";
import { useState } from "react";
import { Notice } from "@/components/ui/notice";
import { ProjectPicker } from "@/components/ui/project-picker";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import type { LabQueue } from "@/lib/lab/queue";
import { dateText, dateTimeText, relativeDays, strengthText } from "./format";
import { StatusBadge } from "./status-badge";
import { Table } from "@/components/ui/table";

type Show = "open" | "all" | "overdue" | "tested";
const STATUS_PARAM: Record<Show, string | null> = { open: "due,overdue", all: null, overdue: "overdue", tested: "tested" };

/** The lab queue across the user's projects, by due date; dense for the office desk. */
export function LabQueueTable() {
  const [projectId, setProjectId] = useState("");
  const [show, setShow] = useState<Show>("open");
  const params = new URLSearchParams();
  if (projectId) params.set("projectId", projectId);
  if (STATUS_PARAM[show]) params.set("status", STATUS_PARAM[show]!);
  const query = useQuery({
    queryKey: ["lab-queue", projectId, show],
    queryFn: async () => {
      const res = await callApi<LabQueue>(`/api/lab/queue?${params}`);
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
  });
  const items = query.data?.items ?? [];
  const overdue = items.filter((i) => i.status === "overdue").length;
  return (
    <section className="card" aria-labelledby="queue-title">
      <div className="flex flex-wrap items-end gap-3 border-b border-ink-100 p-3">
        <h2 id="queue-title" className="mr-auto text-lg font-bold">Tests by due date</h2>
        <ProjectPicker look="form" testId="queue-project" projects={query.data?.projects ?? []} value={projectId} onChange={setProjectId} />
        <Select label="Show" value={show} onChange={(e) => setShow(e.target.value as Show)} data-testid="queue-show">
          <option value="open">Not yet tested</option>
          <option value="overdue">Overdue only</option>
          <option value="tested">Tested</option>
          <option value="all">All</option>
        </Select>
      </div>
      {query.isError ? <Notice tone="danger" title={(query.error as Error).message} className="m-3" /> : null}
      {overdue > 0 ? (
        <Notice tone="danger" title={`${overdue} test${overdue === 1 ? " is" : "s are"} overdue`} className="m-3" testId="queue-overdue-notice">
          The ASTM C39 window for the test age has closed without a break. Ask the lab, and record why in the break or the diary.
        </Notice>
      ) : null}
      {query.isPending ? <p className="p-3 text-muted">Loading…</p> : items.length === 0 ? (
        <p className="p-3 text-muted" data-testid="queue-empty">Nothing here for this choice.</p>
      ) : (
        <>
        {/* On a phone, one card per test: the table's ten columns do not fit 390 px. */}
        <ul className="divide-y divide-ink-100 md:hidden" data-testid="lab-queue-cards">
          {items.map((i) => (
            <li key={i.key} data-testid="queue-card" data-status={i.status} className={clsx("flex flex-col gap-1 p-3", i.status === "overdue" && "bg-danger-50")}>
              <div className="flex flex-wrap items-center gap-2">
                <span className="font-semibold">{dateText(i.dueAt, i.timeZone)}</span>
                {i.status !== "tested" ? <span className="text-xs text-muted">{relativeDays(i.dueAt)}</span> : null}
                <span className="ml-auto"><StatusBadge status={i.status} /></span>
              </div>
              <p className="text-sm">
                <Link href={`/projects/${i.projectId}/lab?placement=${i.placementId}`} className="font-mono font-semibold text-lichen-700 underline-offset-4 hover:underline">{i.setCode}</Link>
                {` · ${i.ageDays} d test · ${i.mixCode ?? "no mix"}`}
              </p>
              <p className="text-sm text-ink-800">{i.projectName} · {i.placementElement}</p>
              <p className="text-xs text-muted">
                Cast {dateTimeText(i.castAt, i.timeZone)} · broken {i.brokenCount}
                {i.averageMPa !== null ? ` · mean ${strengthText(i.averageMPa, i.unitSystem)}` : ""}
              </p>
            </li>
          ))}
        </ul>
        <div className="hidden overflow-x-auto md:block">
          <Table columns={["Due", "Age", "Status", "Set", "Project", "Placement", "Mix", "Cast", { label: "Broken", align: "right" }, { label: "Mean", align: "right" }]} testId="lab-queue">
              {items.map((i) => (
                <tr key={i.key} data-testid="queue-row" data-status={i.status} className={clsx(i.status === "overdue" && "bg-danger-50")}>
                  <td className="whitespace-nowrap px-3 py-1.5"><span className="font-semibold">{dateText(i.dueAt, i.timeZone)}</span>{i.status !== "tested" ? <span className="ml-2 text-xs text-muted">{relativeDays(i.dueAt)}</span> : null}</td>
                  <td className="whitespace-nowrap px-3 py-1.5 font-mono">{i.ageDays} d</td>
                  <td className="px-3 py-1.5"><StatusBadge status={i.status} /></td>
                  <td className="whitespace-nowrap px-3 py-1.5 font-mono">
                    <Link href={`/projects/${i.projectId}/lab?placement=${i.placementId}`} className="font-semibold text-lichen-700 underline-offset-4 hover:underline">{i.setCode}</Link>
                  </td>
                  <td className="px-3 py-1.5">{i.projectName}</td>
                  <td className="px-3 py-1.5">{i.placementElement}</td>
                  <td className="whitespace-nowrap px-3 py-1.5 font-mono">{i.mixCode ?? "—"}</td>
                  <td className="whitespace-nowrap px-3 py-1.5">{dateTimeText(i.castAt, i.timeZone)}</td>
                  <td className="px-3 py-1.5 text-right font-mono">{i.brokenCount}</td>
                  <td className="whitespace-nowrap px-3 py-1.5 text-right font-mono">{strengthText(i.averageMPa, i.unitSystem)}</td>
                </tr>
              ))}
            </Table>
        </div>
        </>
      )}
    </section>
  );
}
