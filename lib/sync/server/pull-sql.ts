// The sync pull's two statements (lib/sync/server/pull.ts), built once per process and run as named
// prepared statements, so PostgreSQL plans them once per connection: the page statement spans every
// record table, and planning it took longer than running it.
import { getTableName, sql } from "drizzle-orm";
import { PgDialect } from "drizzle-orm/pg-core";
import type { QueryConfig } from "pg";
import { jsonFieldsSql } from "@/db/json-rows";
import { conflicts, projectChangeCounters, projects, syncClients } from "@/db/schema";
import { getRecordDef, RECORD_TYPES } from "@/lib/records/registry";
import { userProjectsQuery } from "@/lib/users/queries";

const dialect = new PgDialect();
const ident = (name: string) => `"${name.replace(/"/g, '""')}"`;
const literal = (text: string) => `'${text.replace(/'/g, "''")}'`;

/**
 * Everything an incremental pull needs when nothing changed, in ONE statement (so one snapshot):
 * the device's row, the user's memberships with each project and its last change number, and the
 * user's open conflicts on them. Rows come as JSON with the tables' column names (decodeRow).
 */
export function overviewQuery(userId: string, clientId: string): QueryConfig {
  const t = (table: Parameters<typeof getTableName>[0]) => ident(getTableName(table));
  const query = dialect.sqlToQuery(sql`with mine as ${userProjectsQuery(userId)}
    select
      (select row_to_json(c) from ${sql.raw(t(syncClients))} c where c.id = ${clientId}) as client,
      (select coalesce(json_agg(json_build_object('role', m.role, 'lastSeq', coalesce(k.last_seq, 0), 'project', row_to_json(p)) order by p.name), '[]')
         from mine m join ${sql.raw(t(projects))} p on p.id = m.id left join ${sql.raw(t(projectChangeCounters))} k on k.project_id = m.id) as projects,
      (select coalesce(json_agg(row_to_json(x) order by x.created_at), '[]')
         from ${sql.raw(t(conflicts))} x where x.project_id in (select id from mine) and x.created_by = ${userId} and x.resolved_at is null) as conflicts`);
  return { name: "sync_pull_overview", text: query.sql, values: query.params };
}

let pageText: string | undefined;

/**
 * The next page of one project's changes across every record table, in change-number order: the
 * page's keys first (each table's (projectId, changeSeq) index, `limit + 1` keys at most), then only
 * those rows, each turned by PostgreSQL into the JSON the API sends ({ recordType, record }, dates as
 * toISOString(): db/json-rows.ts), joined into one text. One row comes back: the number of keys
 * found (more than `limit`: there is more), the page's last change number, and the changes' JSON.
 */
export function pageQuery(projectId: string, since: number, limit: number): QueryConfig {
  pageText ??= buildPageText();
  return { name: "sync_pull_page", text: pageText, values: [projectId, since, limit] };
}

function buildPageText(): string {
  const tables = RECORD_TYPES.map((recordType) => ({ recordType, table: getRecordDef(recordType).table }));
  const keys = tables.map(
    ({ recordType, table }) =>
      `(select ${literal(recordType)}::text as record_type, change_seq, id from ${ident(getTableName(table))}
        where project_id = $1::uuid and change_seq > $2::bigint order by change_seq limit $3::int + 1)`,
  );
  const rows = tables.map(
    ({ recordType, table }) =>
      `select kept.change_seq, ${literal(`{"recordType":${JSON.stringify(recordType)},"record":`)} || row_to_json(r)::text || '}' as change
        from kept join ${ident(getTableName(table))} t on t.id = kept.id
        cross join lateral (select ${jsonFieldsSql(table, "t")}) r
        where kept.record_type = ${literal(recordType)}`,
  );
  return `with page as materialized (
      select * from (${keys.join(" union all ")}) k order by change_seq limit $3::int + 1
    ), kept as materialized (select * from page order by change_seq limit $3::int)
    select (select count(*) from page)::int as found,
      (select max(change_seq) from kept)::text as last_seq,
      (select string_agg(change, ',' order by change_seq) from (${rows.join(" union all ")}) x) as changes`;
}
