// The office's placement list across projects: one SQL statement per page (filter, aggregate,
// count and page together), after one read of the user's memberships.
//
// The per-placement figures apply the same rules as the digest's warnings (lib/digest), in SQL:
// - late trucks: not rejected, discharge finished, finish not before batching, and more minutes
//   than the project's discharge limit (ASTM C94 §10.7, lib/concrete checkDischarge);
// - revolutions over: the same trucks, over the project's revolution limit where one is set;
// - water added: every ticket with water added at the site (the digest warns on each);
// - tests out of tolerance: tests with a slump or air outside the mix's range (ASTM C94 §7 bands of
//   lib/concrete slumpRangeMm / airRangePct, or the mix's own tolerance) or a concrete temperature
//   above the mix's (else the project's) maximum (ACI 305.1), as lib/digest testProblems;
// - evaporation risk: the highest risk of the readings taken for the placement (ACI 305R thresholds,
//   halved for a low-bleed mix, or the project's own), as lib/concrete evaporationRisk.
// Simplifications: site-wide readings (no placement) and cold weather are day-level warnings and are
// not attributed to a placement; low strength is the lab's (breaks) and not part of "has warnings".
// tests/integration/review.test.ts checks these columns against the lib functions on varied records.
import { sql, type SQL } from "drizzle-orm";
import { db, type Executor } from "@/db";
import type { SessionUser } from "@/lib/auth/options";
import { KG_M2_H_PER_LB_FT2_H, MM_PER_IN } from "@/lib/concrete/units";
import { readableProjects, uuidArray } from "./access";
import type { EvaporationRiskLevel, PlacementListQuery, PlacementReviewRow, PlacementSort, ReviewPage } from "./query";

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

// Inclusive bounds with lib/concrete's edge tolerance (atLeast/atMost: 1e-9 relative).
const outside = (v: string, min: string, max: string) =>
  `(${v} < (${min}) - 1e-9 * greatest(1, abs(${min})) or ${v} > (${max}) + 1e-9 * greatest(1, abs(${max})))`;

// ASTM C94 §7 default slump ranges, in the project's unit system (as lib/concrete slumpRangeMm: the
// IP bands apply to the target in inches rounded to 1e-6; the result is back in mm).
const SLUMP_IN = `(floor(m.slump_target_mm / ${MM_PER_IN} * 1e6 + 0.5) / 1e6)`;
const SLUMP_MIN = `case
  when m.slump_tolerance_mm is not null then greatest(0, m.slump_target_mm - m.slump_tolerance_mm)
  when pr.unit_system = 'SI' and m.slump_type = 'target' then greatest(0, m.slump_target_mm - case when m.slump_target_mm <= 50 then 15 when m.slump_target_mm <= 100 then 25 else 40 end)
  when pr.unit_system = 'SI' then greatest(0, m.slump_target_mm - case when m.slump_target_mm <= 75 then 40 else 65 end)
  when m.slump_type = 'target' then greatest(0, ${SLUMP_IN} - case when ${SLUMP_IN} <= 2 then 0.5 when ${SLUMP_IN} <= 4 then 1 else 1.5 end) * ${MM_PER_IN}
  else greatest(0, ${SLUMP_IN} - case when ${SLUMP_IN} <= 3 then 1.5 else 2.5 end) * ${MM_PER_IN}
end`;
const SLUMP_MAX = `case
  when m.slump_tolerance_mm is not null then case when m.slump_type = 'maximum' then m.slump_target_mm else m.slump_target_mm + m.slump_tolerance_mm end
  when pr.unit_system = 'SI' and m.slump_type = 'target' then m.slump_target_mm + case when m.slump_target_mm <= 50 then 15 when m.slump_target_mm <= 100 then 25 else 40 end
  when pr.unit_system = 'SI' then m.slump_target_mm
  when m.slump_type = 'target' then (${SLUMP_IN} + case when ${SLUMP_IN} <= 2 then 0.5 when ${SLUMP_IN} <= 4 then 1 else 1.5 end) * ${MM_PER_IN}
  else ${SLUMP_IN} * ${MM_PER_IN}
end`;
const AIR_TOL = "coalesce(m.air_tolerance_pct, 1.5)";
const TEST_OUT = `(
  (m.id is not null and t.slump_mm is not null and m.slump_target_mm is not null and ${outside("t.slump_mm", SLUMP_MIN, SLUMP_MAX)})
  or (m.id is not null and t.air_pct is not null and m.air_target_pct is not null
      and ${outside("t.air_pct", `greatest(0, m.air_target_pct - ${AIR_TOL})`, `m.air_target_pct + ${AIR_TOL}`)})
  or (t.concrete_temp_c is not null and t.concrete_temp_c > coalesce(m.max_concrete_temp_c, pr.max_concrete_temp_c))
)`;

// ACI 305R thresholds in the project's unit system: 0.5 / 1.0 kg/m²/h, 0.1 / 0.2 lb/ft²/h, halved for
// a low-bleed mix; a project override sets "high" and caution at half of it.
const RATE = `case when pr.unit_system = 'SI' then w.evaporation_kg_m2_h else w.evaporation_kg_m2_h / ${KG_M2_H_PER_LB_FT2_H} end`;
const HIGH = `case when pr.evaporation_high_kg_m2_h is not null
  then case when pr.unit_system = 'SI' then pr.evaporation_high_kg_m2_h else pr.evaporation_high_kg_m2_h / ${KG_M2_H_PER_LB_FT2_H} end
  else case when pr.unit_system = 'SI' then 1.0 else 0.2 end * case when coalesce(m.low_bleed, false) then 0.5 else 1 end end`;
const CAUTION = `case when pr.evaporation_high_kg_m2_h is not null then (${HIGH}) / 2
  else case when pr.unit_system = 'SI' then 0.5 else 0.1 end * case when coalesce(m.low_bleed, false) then 0.5 else 1 end end`;

const DISCHARGE_MIN = "extract(epoch from (d.discharge_finished_at - d.batched_at)) / 60";
const CHECKED_TRUCK = `d.status <> 'rejected' and d.discharge_finished_at is not null and d.discharge_finished_at >= d.batched_at`;

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
      coalesce(dl.late, 0) as late_trucks, coalesce(dl.revs_over, 0) as revolutions_over,
      coalesce(dl.water_l, 0) as water_added_l, coalesce(dl.water_loads, 0) as water_loads,
      coalesce(ft.tests_out, 0) as tests_out, wr.risk_rank, wr.max_evap,
      (coalesce(dl.late, 0) + coalesce(dl.revs_over, 0) + coalesce(dl.water_loads, 0) + coalesce(ft.tests_out, 0) > 0
        or coalesce(wr.risk_rank, 0) = 3) as has_warnings,
      p.state, p.signed_at, su.name as signed_by_name
    from placements p
    join projects pr on pr.id = p.project_id
    left join mix_designs m on m.id = p.mix_id and m.project_id = p.project_id
    left join users su on su.id = p.signed_by
    left join lateral (
      select count(*)::int as trucks,
        count(*) filter (where d.status = 'rejected')::int as rejected,
        sum(d.volume_m3) filter (where d.status <> 'rejected') as placed_m3,
        count(*) filter (where ${sql.raw(CHECKED_TRUCK)} and ${sql.raw(DISCHARGE_MIN)} > pr.discharge_limit_minutes)::int as late,
        count(*) filter (where ${sql.raw(CHECKED_TRUCK)} and pr.revolution_limit is not null and d.revolutions > pr.revolution_limit)::int as revs_over,
        sum(d.water_added_l) filter (where d.water_added_l > 0) as water_l,
        count(*) filter (where d.water_added_l > 0)::int as water_loads
      from deliveries d where d.placement_id = p.id and d.project_id = p.project_id and d.deleted_at is null
    ) dl on true
    left join lateral (
      select count(*) filter (where ${sql.raw(TEST_OUT)})::int as tests_out
      from field_tests t where t.placement_id = p.id and t.project_id = p.project_id and t.deleted_at is null
    ) ft on true
    left join lateral (
      select max(case when ${sql.raw(RATE)} >= ${sql.raw(HIGH)} then 3 when ${sql.raw(RATE)} >= ${sql.raw(CAUTION)} then 2 else 1 end) as risk_rank,
        max(w.evaporation_kg_m2_h) as max_evap
      from weather_observations w
      where w.placement_id = p.id and w.project_id = p.project_id and w.deleted_at is null and w.evaporation_kg_m2_h is not null
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
  if (projects.length === 0) return { rows: [], total: 0, page: q.page, pageSize: q.pageSize };
  const offset = (q.page - 1) * q.pageSize;
  const result = await tx.execute(sql`
    with f as (${filteredAndWarned(projects.map((p) => p.id), q)}),
    n as (select count(*)::int as total from f)
    select n.total, pg.* from n left join lateral (
      select * from f order by ${orderBy(q)} limit ${q.pageSize} offset ${offset}
    ) pg on true`);
  const raw = result.rows as Raw[];
  const total = raw.length ? Number(raw[0].total) : 0;
  return { rows: raw.filter((r) => r.id !== null).map(toRow), total, page: q.page, pageSize: q.pageSize };
}

/** Every matching row in the list's order, for an export (bounded: at most `limit` rows). */
export async function allReviewPlacements(user: SessionUser, q: PlacementListQuery, limit: number, tx: Executor = db): Promise<PlacementReviewRow[]> {
  const projects = await readableProjects(user, q.projects, tx);
  if (projects.length === 0) return [];
  const result = await tx.execute(sql`
    select 0 as total, f.* from (${filteredAndWarned(projects.map((p) => p.id), q)}) f order by ${orderBy(q)} limit ${limit}`);
  return (result.rows as Raw[]).map(toRow);
}
