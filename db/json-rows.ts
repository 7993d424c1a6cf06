// Rows to and from the database as JSON, for the sync path's set-based statements.
// insertMany: a multi-row INSERT … RETURNING * that sends its rows as ONE JSON parameter
// (json_populate_recordset), for the sync push's set-based writes. The ORM's multi-row insert
// renders one placeholder per value; for a push of 100 records, building that statement cost more
// CPU than the database spent running it. Values are encoded and decoded by the ORM's own column
// mappers, so the rows read back are the ones `insert().values().returning()` would give.
import { getTableColumns, sql, type Column, type SQL } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import type { Executor } from "./index";

const isJson = (column: Column) => column.columnType === "PgJsonb" || column.columnType === "PgJson";

/** JSON for json_populate_recordset: the column's driver value (a string is read by the type's input). */
function encode(column: Column, value: unknown): unknown {
  if (value === null) return null;
  if (isJson(column)) return value;
  const driver = column.mapToDriverValue(value);
  return driver instanceof Date ? driver.toISOString() : driver;
}

/**
 * Inserts `rows` (keys as in the table's TypeScript shape) and returns the stored rows, grouped by
 * the set of fields given (a field left out takes its column default, as with the ORM's insert).
 * `returning: false` returns nothing: the audit entries are written and not read back, which
 * spares sending, parsing and decoding their JSON a second time.
 */
export async function insertMany<T extends PgTable>(
  tx: Executor,
  table: T,
  rows: Record<string, unknown>[],
  { returning = true }: { returning?: boolean } = {},
): Promise<T["$inferSelect"][]> {
  const stored: T["$inferSelect"][] = [];
  for (const statement of insertStatements(table, rows)) {
    const result = await tx.execute(returning ? sql`${statement} returning *` : statement);
    if (returning) for (const raw of result.rows as Record<string, unknown>[]) stored.push(decodeRow(table, raw));
  }
  return stored;
}

/**
 * The INSERT statements of insertMany, one per set of fields given, without RETURNING: for a caller
 * that runs one as a data-modifying WITH of its next statement (one round trip for both).
 */
export function insertStatements(table: PgTable, rows: Record<string, unknown>[]): SQL[] {
  const columns = getTableColumns(table) as Record<string, Column>;
  const groups = new Map<string, Record<string, unknown>[]>();
  for (const row of rows) {
    const keys = Object.keys(row)
      .filter((key) => row[key] !== undefined && key in columns)
      .sort()
      .join(",");
    const group = groups.get(keys);
    if (group) group.push(row);
    else groups.set(keys, [row]);
  }
  return [...groups].map(([keyList, group]) => {
    const keys = keyList.split(",");
    const names = sql.join(
      keys.map((key) => sql.identifier(columns[key].name)),
      sql`, `,
    );
    const json = group.map((row) => Object.fromEntries(keys.map((key) => [columns[key].name, encode(columns[key], row[key])])));
    return sql`insert into ${table} (${names}) select ${names} from json_populate_recordset(null::${table}, ${JSON.stringify(json)}::json)`;
  });
}

/**
 * A row read as the database gives it (keys are column names: `RETURNING *`, or `row_to_json`),
 * decoded by the ORM's column mappers into the shape `select()` gives.
 */
export function decodeRow<T extends PgTable>(table: T, raw: Record<string, unknown>): T["$inferSelect"] {
  const row: Record<string, unknown> = {};
  for (const [key, column] of columnsOf(table)) {
    const value = raw[column.name];
    row[key] = value === null || value === undefined ? null : column.mapFromDriverValue(value);
  }
  return row as T["$inferSelect"];
}

// A pull page decodes hundreds of rows of the same few tables: list each table's columns once.
const columnLists = new WeakMap<PgTable, [string, Column][]>();
function columnsOf(table: PgTable): [string, Column][] {
  let list = columnLists.get(table);
  if (!list) columnLists.set(table, (list = Object.entries(getTableColumns(table) as Record<string, Column>)));
  return list;
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;
// Columns whose to_json() is already what JSON.stringify gives for the ORM's decoded value.
const JSON_AS_IS = new Set(["PgUUID", "PgInteger", "PgSmallInt", "PgBigInt53", "PgSerial", "PgVarchar", "PgText", "PgChar", "PgEnumColumn", "PgBoolean", "PgDoublePrecision", "PgReal", "PgDateString", "PgJsonb", "PgJson", "PgArray"]);
// Date.prototype.toJSON: UTC, milliseconds (truncated, as the driver's Date keeps them), "Z".
const ISO_MS = `'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'`;

/**
 * A select list that gives, for row `alias` of `table`, the columns under their TypeScript keys and
 * in the JSON form `JSON.stringify(select() row)` would have (timestamps as toISOString()), so
 * `row_to_json` of it is the row as the API sends it, built by PostgreSQL without a JavaScript object
 * per row. A column type not known here throws at once (decodeRow covers it; add it here).
 */
export function jsonFieldsSql(table: PgTable, alias: string): string {
  return columnsOf(table)
    .map(([key, column]) => {
      const ref = `${quoteIdent(alias)}.${quoteIdent(column.name)}`;
      let value: string;
      const base = column.columnType === "PgArray" ? (column as Column & { baseColumn: Column }).baseColumn.columnType : column.columnType;
      if (JSON_AS_IS.has(base) && base !== "PgArray") value = ref;
      else if (column.columnType === "PgTimestamp") {
        const utc = (column as Column & { withTimezone?: boolean }).withTimezone ? `${ref} at time zone 'UTC'` : ref;
        value = `to_char(${utc}, ${ISO_MS})`;
      } else throw new Error(`jsonFieldsSql: column ${column.name} of type ${column.columnType} has no JSON form here`);
      return `${value} as ${quoteIdent(key)}`;
    })
    .join(", ");
}
