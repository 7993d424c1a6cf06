// The office's placement list across projects: one SQL statement per page (filter, aggregate,
// count and page together), after one read of the user's memberships.
//
// The per-placement figures are the rulebook's (lib/checks), as the server stored them after the last
// write (lib/findings, table check_findings): late trucks, revolutions over an ordered limit, loads
// with water added at the site, out-of-tolerance tests, the highest evaporation finding, and "has
// warnings" (any caution or warning of the placement, or of its day: cold or hot weather). No rule
// is written here; tests/integration/review/figures.test.ts compares the columns with lib/checks.
import { sql, type SQL } from "drizzle-orm";
import { db, type Executor } from "@/db";
import type { SessionUser } from "@/lib/auth/options";
import { readableProjects } from "@/lib/projects/readable";
import { uuidArray } from "./access";
import { allOf, emptyPage, pageOf } from "./page";
import type { EvaporationRiskLevel, PlacementListQuery, PlacementReviewRow, PlacementSort, ReviewPage } from "./query-schemas";

// Whitelisted sort expressions over the columns of the filtered set (never user text in SQL).
const SORT_SQL: Record<PlacementSort, string> = {
  date: "planned_start",
  project: "project_name",
  element: "element",
  mix: "mix_code",
  orderedM3: "ordered_m3",
  placedM3: "placed_m3",
  trucks: "trucks",
  lateTrucks: "late_trucks",
  waterAddedL: "water_added_l",
  testsOut: "tests_out",
  evaporationRisk: "risk_rank",
  state: "state::text",
  signedBy: "signed_by_name",
};

const RISK: Record<number, EvaporationRiskLevel> = { 1: "low", 2: "caution", 3: "high" };

/** The filtered set, one row per placement with its aggregates (the base of pages and exports). */
function filteredSet(projectIds: string[], q: PlacementListQuery): SQL {
  const where: SQL[] = [sql`p.deleted_at is null`, sql`p.project_id = any(${uuidArray(projectIds)}::uuid[])`];
  // The local date is the planned start in the project's time zone; the instant bounds (±1 day)
  // only let the (project, planned_start) index narrow the scan.
  if (q.from) where.push(sql`p.planned_start >= ${q.from}::date - 1`, sql`(p.planned_start at time zone pr.time_zone)::date >= ${q.from}::date`);
  if (q.to) where.push(sql`p.planned_start < ${q.to}::date + 2`, sql`(p.planned_start at time zone pr.time_zone)::date <= ${q.to}::date`);
  if (q.state?.length) where.push(sql`p.state::text = any(${`{${q.state.join(",")}}`}::text[])`);
  return sql`
    select p.id, p.project_id, pr.name as project_name, pr.code as project_code, pr.unit_system,
      to_char((p.planned_start at time zone pr.time_zone)::date, 'YYYY-MM-DD') as local_date,
      p.planned_start, p.element, p.level, p.grid, m.code as mix_code, p.planned_volume_m3 as ordered_m3,
      coalesce(dl.placed_m3, 0) as placed_m3, coalesce(dl.trucks, 0) as trucks, coalesce(dl.rejected, 0) as rejected,
      cf.late as late_trucks, cf.revs_over as revolutions_over,
      coalesce(dl.water_l, 0) as water_added_l, cf.water_loads,
      cf.tests_out, case when wr.readings > 0 then coalesce(cf.evap_rank, 1) end as risk_rank, wr.max_evap,
      (cf.findings + df.day_findings > 0) as has_warnings,
      p.state, p.signed_at, su.name as signed_by_name
    from placements p
    join projects pr on pr.id = p.project_id
    left join mix_designs m on m.id = p.mix_id and m.project_id = p.project_id
    left join users su on su.id = p.signed_by
    left join lateral (
      select count(*)::int as trucks,
        count(*) filter (where d.status = 'rejected')::int as rejected,
        sum(d.volume_m3) filter (where d.status <> 'rejected') as placed_m3,
        sum(d.water_added_l) filter (where d.water_added_l > 0) as water_l
      from deliveries d where d.placement_id = p.id and d.project_id = p.project_id and d.deleted_at is null
    ) dl on true
    left join lateral (
      select count(distinct f.subject_id) filter (where f.rule = 'discharge-time')::int as late,
        count(distinct f.subject_id) filter (where f.rule = 'revolutions')::int as revs_over,
        count(distinct f.subject_id) filter (where f.rule = 'site-water')::int as water_loads,
        count(distinct f.subject_id) filter (where f.subject_type = 'field-test')::int as tests_out,
        max(case when f.rule = 'evaporation' and f.severity = 'warning' then 3 when f.rule = 'evaporation' then 2 end) as evap_rank,
        count(*)::int as findings
      from check_findings f where f.placement_id = p.id and f.project_id = p.project_id
    ) cf on true
    left join lateral (
      select count(*)::int as day_findings from check_findings f
      where f.project_id = p.project_id and f.placement_id is null and f.subject_type = 'day'
        and f.local_date = (p.planned_start at time zone pr.time_zone)::date
    ) df on true
    left join lateral (
      select max(w.evaporation_kg_m2_h) as max_evap, count(*)::int as readings
      from weather_observations w
      where w.placement_id = p.id and w.project_id = p.project_id and w.deleted_at is null
    ) wr on true
    where ${sql.join(where, sql` and `)}`;
}

function filteredAndWarned(projectIds: string[], q: PlacementListQuery): SQL {
  const base = filteredSet(projectIds, q);
  if (q.hasWarnings === undefined) return base;
  return sql`select * from (${base}) b where b.has_warnings = ${q.hasWarnings}`;
}

function orderBy(q: PlacementListQuery): SQL {
  const dir = q.dir === "asc" ? "asc" : "desc";
  const nulls = dir === "asc" ? "nulls first" : "nulls last";
  return sql.raw(`${SORT_SQL[q.sort]} ${dir} ${nulls}, planned_start ${dir}, id ${dir}`);
}

type Raw = {
  total: number;
  id: string | null;
  project_id: string;
  project_name: string;
  project_code: string;
  unit_system: "SI" | "IP";
  local_date: string;
  planned_start: string | Date;
  element: string;
  level: string;
  grid: string;
  mix_code: string | null;
  ordered_m3: number | null;
  placed_m3: number;
  trucks: number;
  rejected: number;
  late_trucks: number;
  revolutions_over: number;
  water_added_l: number;
  water_loads: number;
  tests_out: number;
  risk_rank: number | null;
  max_evap: number | null;
  has_warnings: boolean;
  state: PlacementReviewRow["state"];
  signed_at: string | Date | null;
  signed_by_name: string | null;
};

const iso = (v: string | Date | null) => (v === null ? null : new Date(v).toISOString());

function toRow(r: Raw): PlacementReviewRow {
  return {
    id: r.id!,
    projectId: r.project_id,
    projectName: r.project_name,
    projectCode: r.project_code,
    unitSystem: r.unit_system,
    date: r.local_date,
    plannedStart: iso(r.planned_start)!,
    element: r.element,
    level: r.level,
    grid: r.grid,
    mixCode: r.mix_code,
    orderedM3: r.ordered_m3 === null ? null : Number(r.ordered_m3),
    placedM3: Number(r.placed_m3),
    trucks: Number(r.trucks),
    rejectedTrucks: Number(r.rejected),
    lateTrucks: Number(r.late_trucks),
    revolutionsOver: Number(r.revolutions_over),
    waterAddedL: Number(r.water_added_l),
    waterLoads: Number(r.water_loads),
    testsOut: Number(r.tests_out),
    evaporationRisk: r.risk_rank === null ? null : RISK[Number(r.risk_rank)],
    maxEvaporationKgM2H: r.max_evap === null ? null : Number(r.max_evap),
    hasWarnings: r.has_warnings,
    state: r.state,
    signedAt: iso(r.signed_at),
    signedBy: r.signed_by_name,
  };
}

/** One page of the list and the total count of matching rows, in one statement. */
export async function listReviewPlacements(user: SessionUser, q: PlacementListQuery, tx: Executor = db): Promise<ReviewPage<PlacementReviewRow>> {
  const projects = await readableProjects(user, q.projects, tx);
  if (projects.length === 0) return emptyPage(q);
  return pageOf(tx, filteredAndWarned(projects.map((p) => p.id), q), orderBy(q), q, (r: Raw) => r.id !== null, toRow);
}

/** Every matching row in the list's order, for an export (bounded: at most `limit` rows). */
export async function allReviewPlacements(user: SessionUser, q: PlacementListQuery, limit: number, tx: Executor = db): Promise<PlacementReviewRow[]> {
  const projects = await readableProjects(user, q.projects, tx);
  if (projects.length === 0) return [];
  return allOf(tx, filteredAndWarned(projects.map((p) => p.id), q), orderBy(q), limit, toRow);
}
