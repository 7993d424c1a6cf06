// The sync pull lets PostgreSQL write each record's JSON (db/json-rows.ts jsonFieldsSql), so a
// device must receive exactly what it received when the server decoded rows with the ORM and
// serialised them with JSON.stringify. Reference: drizzle-orm's own column mappers (decodeRow gives
// the shape select() gives) and ECMAScript's Date.prototype.toJSON (toISOString: UTC, milliseconds,
// "Z") [ECMA-262 §21.4.4.37]. Every record table, every column, with values that stress the edges:
// microseconds (the driver's Date keeps milliseconds, truncated), quotes and non-ASCII text, small
// and large doubles, arrays, JSON, and a row of nulls.
import { randomUUID } from "node:crypto";
import { getTableColumns, sql, type Column } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { decodeRow, jsonFieldsSql } from "@/db/json-rows";
import { getRecordDef, RECORD_TYPES } from "@/lib/records/registry";

const TIMES = ["2026-12-03T18:27:50.123456Z", "2026-01-31T23:59:59.999999Z", "2026-07-04T05:06:07Z", "1999-12-31T23:59:59.000500+05:30"];
const DOUBLES = [0.1, 1e-7, 12345678.9, -3.25, 2.5e21];

function valueFor(column: Column, i: number): unknown {
  const type = column.columnType;
  if (type === "PgArray") {
    const base = (column as Column & { baseColumn: Column }).baseColumn.columnType;
    return base === "PgUUID" ? [randomUUID(), randomUUID()] : [1, 7, 28];
  }
  if (type === "PgUUID") return randomUUID();
  if (type === "PgInteger" || type === "PgSmallInt") return 42 + i;
  if (type === "PgBigInt53") return 9_007_199_254 + i;
  if (type === "PgVarchar" || type === "PgText") return `"Ä"\\ñ ${i}`;
  if (type === "PgEnumColumn") return (column as Column & { enumValues: string[] }).enumValues.at(-1);
  if (type === "PgBoolean") return i % 2 === 0;
  if (type === "PgDoublePrecision" || type === "PgReal") return DOUBLES[i % DOUBLES.length];
  if (type === "PgDateString") return "2028-02-29";
  if (type === "PgJsonb" || type === "PgJson") return { zeta: 1, a: [1.5, "x", null], nested: { "k\"ey": "☃" } };
  if (type === "PgTimestamp") return TIMES[i % TIMES.length];
  throw new Error(`no test value for ${column.name} (${type})`);
}

async function both(table: PgTable, row: Record<string, unknown>) {
  const json = JSON.stringify(row);
  const built = await db.execute(
    sql`select row_to_json(r)::text as built from json_populate_record(null::${table}, ${json}::json) t cross join lateral (select ${sql.raw(jsonFieldsSql(table, "t"))}) r`,
  );
  const raw = await db.execute(sql`select t.* from json_populate_record(null::${table}, ${json}::json) t`);
  return {
    fromDatabase: (built.rows[0] as { built: string }).built,
    fromOrm: JSON.stringify(decodeRow(table, raw.rows[0] as Record<string, unknown>)),
  };
}

describe("a pulled record's JSON, written by PostgreSQL", () => {
  for (const recordType of RECORD_TYPES) {
    it(`${recordType}: equals JSON.stringify of the ORM's row, key for key, with values and with nulls`, async () => {
      const table = getRecordDef(recordType).table;
      const columns = Object.values(getTableColumns(table) as Record<string, Column>);
      const full = Object.fromEntries(columns.map((c, i) => [c.name, valueFor(c, i)]));
      const nulls = Object.fromEntries(columns.map((c, i) => [c.name, c.notNull ? valueFor(c, i + 1) : null]));
      for (const row of [full, nulls]) {
        const { fromDatabase, fromOrm } = await both(table, row);
        expect(JSON.parse(fromDatabase)).toEqual(JSON.parse(fromOrm));
        expect(Object.keys(JSON.parse(fromDatabase))).toEqual(Object.keys(JSON.parse(fromOrm)));
      }
    });
  }

  it("a column type it does not know is refused by name, not sent in another form", async () => {
    const { pgTable, numeric } = await import("drizzle-orm/pg-core");
    const odd = pgTable("odd", { volume: numeric("volume_m3") });
    expect(() => jsonFieldsSql(odd, "t")).toThrow(/volume_m3 of type PgNumeric/);
  });
});
