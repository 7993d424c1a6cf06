// The office's diary list: one row per project and work day in the range, with "missing" rows for
// work days without a diary. One SQL statement per page after one read of the memberships.
//
// A work day is a weekday (Monday to Friday), or any day with a placement planned to start on it or
// with a diary (weekend work shows up; an idle weekend is not "missing"). Dates are project-local.
// Days run from the later of the range start and the project's first day (its creation or its
// first placement or diary, whichever is earliest) to the earlier of the range end and today in the
// project's time zone: a future day cannot be missing yet. The range defaults to the last 14 days.
import { sql, type SQL } from "drizzle-orm";
import { db, type Executor } from "@/db";
import type { SessionUser } from "@/lib/auth/options";
import { readableProjects } from "@/lib/projects/readable";
import { uuidArray } from "./access";
import { allOf, emptyPage, pageOf } from "./page";
import { MAX_DIARY_RANGE_DAYS, type DiaryListQuery, type DiaryReviewRow, type DiarySort, type ReviewPage } from "./query-schemas";

const SORT_SQL: Record<DiarySort, string> = {
  date: "day",
  project: "project_name",
  state: "state",
  placements: "placements",
  crew: "crew",
  delayMinutes: "delay_minutes",
  submittedBy: "submitted_by_name",
};

const DEFAULT_DAYS = 14;

function range(q: DiaryListQuery): { from: string; to: string } {
  const today = new Date();
  const to = q.to ?? new Date(today.getTime() + 86_400_000).toISOString().slice(0, 10); // clamped per project below
  const from = q.from ?? new Date(Date.parse(to) - (DEFAULT_DAYS - 1) * 86_400_000).toISOString().slice(0, 10);
  if ((Date.parse(to) - Date.parse(from)) / 86_400_000 >= MAX_DIARY_RANGE_DAYS) {
    return { from: new Date(Date.parse(to) - (MAX_DIARY_RANGE_DAYS - 1) * 86_400_000).toISOString().slice(0, 10), to };
  }
  return { from, to };
}

function filteredSet(projectIds: string[], q: DiaryListQuery): SQL {
  const { from, to } = range(q);
  const states = q.state?.length ? sql`where s.state = any(${`{${q.state.join(",")}}`}::text[])` : sql``;
  return sql`
    select * from (
      select pr.id as project_id, pr.name as project_name, pr.code as project_code, g.day, to_char(g.day, 'YYYY-MM-DD') as day_text,
        extract(isodow from g.day) < 6 as weekday,
        de.id as diary_id,
        case when de.id is null then 'missing' when de.submitted_at is null then 'draft' else 'submitted' end as state,
        coalesce(pl.n, 0) as placements, coalesce(cr.n, 0) as crew, coalesce(dl.n, 0) as delay_minutes,
        de.submitted_at, su.name as submitted_by_name
      from projects pr
      cross join lateral (
        select least(
          (pr.created_at at time zone pr.time_zone)::date,
          coalesce((select min((p.planned_start at time zone pr.time_zone)::date) from placements p where p.project_id = pr.id and p.deleted_at is null), 'infinity'::date),
          coalesce((select min(d.date) from diary_entries d where d.project_id = pr.id and d.deleted_at is null), 'infinity'::date)
        ) as first_day, (now() at time zone pr.time_zone)::date as today
      ) b
      cross join lateral generate_series(greatest(${from}::date, b.first_day), least(${to}::date, b.today), interval '1 day') as gs(ts)
      cross join lateral (select gs.ts::date as day) g
      left join diary_entries de on de.project_id = pr.id and de.date = g.day and de.deleted_at is null
      left join users su on su.id = de.submitted_by
      left join lateral (
        select count(*)::int as n from placements p
        where p.project_id = pr.id and p.deleted_at is null
          and p.planned_start >= g.day - 1 and p.planned_start < g.day + 2
          and (p.planned_start at time zone pr.time_zone)::date = g.day
      ) pl on true
      left join lateral (select sum(c.count)::int as n from diary_crew c where c.diary_entry_id = de.id and c.deleted_at is null) cr on true
      left join lateral (select sum(x.minutes)::int as n from diary_delays x where x.diary_entry_id = de.id and x.deleted_at is null) dl on true
      where pr.id = any(${uuidArray(projectIds)}::uuid[])
        and (extract(isodow from g.day) < 6 or de.id is not null or coalesce(pl.n, 0) > 0)
    ) s ${states}`;
}

function orderBy(q: DiaryListQuery): SQL {
  const dir = q.dir === "asc" ? "asc" : "desc";
  const nulls = dir === "asc" ? "nulls first" : "nulls last";
  return sql.raw(`${SORT_SQL[q.sort]} ${dir} ${nulls}, day ${dir}, project_name asc`);
}

type Raw = {
  total: number;
  project_id: string | null;
  project_name: string;
  project_code: string;
  day_text: string;
  weekday: boolean;
  diary_id: string | null;
  state: DiaryReviewRow["state"];
  placements: number;
  crew: number;
  delay_minutes: number;
  submitted_at: string | Date | null;
  submitted_by_name: string | null;
};

function toRow(r: Raw): DiaryReviewRow {
  return {
    projectId: r.project_id!,
    projectName: r.project_name,
    projectCode: r.project_code,
    date: r.day_text,
    weekday: r.weekday,
    diaryId: r.diary_id,
    state: r.state,
    placements: Number(r.placements),
    crew: Number(r.crew),
    delayMinutes: Number(r.delay_minutes),
    submittedAt: r.submitted_at === null ? null : new Date(r.submitted_at).toISOString(),
    submittedBy: r.submitted_by_name,
  };
}

export async function listReviewDiaries(user: SessionUser, q: DiaryListQuery, tx: Executor = db): Promise<ReviewPage<DiaryReviewRow>> {
  const projects = await readableProjects(user, q.projects, tx);
  if (projects.length === 0) return emptyPage(q);
  return pageOf(tx, filteredSet(projects.map((p) => p.id), q), orderBy(q), q, (r: Raw) => r.project_id !== null, toRow);
}

export async function allReviewDiaries(user: SessionUser, q: DiaryListQuery, limit: number, tx: Executor = db): Promise<DiaryReviewRow[]> {
  const projects = await readableProjects(user, q.projects, tx);
  if (projects.length === 0) return [];
  return allOf(tx, filteredSet(projects.map((p) => p.id), q), orderBy(q), limit, toRow);
}
