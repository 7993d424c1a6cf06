// The statements every review list runs over its filtered set (a SQL fragment of rows): one page
// with the total count of matching rows, or every row for an export.
import { sql, type SQL } from "drizzle-orm";
import type { Executor } from "@/db";
import type { ReviewPage } from "./query-schemas";

type Paging = { page: number; pageSize: number };

export const emptyPage = <Row>(q: Paging): ReviewPage<Row> => ({ rows: [], total: 0, page: q.page, pageSize: q.pageSize });

/**
 * One page and the total, in one statement: the count beside a lateral page, so a page past the end
 * still carries the total (its one row has the count and nulls, which `present` leaves out).
 */
export async function pageOf<Raw extends { total: number | string | null }, Row>(
  tx: Executor,
  filtered: SQL,
  orderBy: SQL,
  q: Paging,
  present: (raw: Raw) => boolean,
  toRow: (raw: Raw) => Row,
): Promise<ReviewPage<Row>> {
  const offset = (q.page - 1) * q.pageSize;
  const result = await tx.execute(sql`
    with f as (${filtered}),
    n as (select count(*)::int as total from f)
    select n.total, pg.* from n left join lateral (
      select * from f order by ${orderBy} limit ${q.pageSize} offset ${offset}
    ) pg on true`);
  const raw = result.rows as Raw[];
  const total = raw.length ? Number(raw[0].total) : 0;
  return { rows: raw.filter(present).map(toRow), total, page: q.page, pageSize: q.pageSize };
}

/** Every matching row in the list's order, for an export (bounded: at most `limit` rows). */
export async function allOf<Raw, Row>(tx: Executor, filtered: SQL, orderBy: SQL, limit: number, toRow: (raw: Raw) => Row): Promise<Row[]> {
  const result = await tx.execute(sql`select f.* from (${filtered}) f order by ${orderBy} limit ${limit}`);
  return (result.rows as Raw[]).map(toRow);
}
