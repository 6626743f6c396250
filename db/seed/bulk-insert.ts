import { getTableColumns, getTableName, is, SQL, type Column, type Table } from "drizzle-orm";
import type { InStatement, InValue } from "@libsql/client";

/** What a row that leaves the column out gets: the column's default, as drizzle would send it. */
function missing(column: Column): InValue {
  const value = column.defaultFn ? column.defaultFn() : column.default;
  if (value === undefined || value === null) return null;
  if (is(value, SQL)) throw new Error(`insertStatements: column ${column.name} has an SQL default; give it a value in every row.`);
  return column.mapToDriverValue(value) as InValue;
}

/**
 * Multi-row INSERT statements for a table, each value mapped to the driver by the column's own
 * drizzle mapping (JSON, timestamps, booleans) and a left-out column given its default — but
 * without building a query object per chunk: the large seed writes millions of rows and the
 * query builder was a third of its time. Builds only (it runs in worker threads too); the
 * caller executes the statements, usually in one batch.
 */
export function insertStatements<T extends Table>(table: T, rows: T["$inferInsert"][], maxParams = 30_000): InStatement[] {
  if (!rows.length) return [];
  const all = getTableColumns(table) as Record<string, Column>;
  const given = new Set<string>();
  for (const row of rows) for (const [k, v] of Object.entries(row as object)) if (v !== undefined && k in all) given.add(k);
  const keys = Object.keys(all).filter((k) => given.has(k) || all[k].defaultFn || all[k].default !== undefined);
  const columns = keys.map((k) => all[k]);
  const head = `insert into "${getTableName(table)}" (${columns.map((c) => `"${c.name}"`).join(", ")}) values `;
  const tuple = `(${columns.map(() => "?").join(", ")})`;
  const perStatement = Math.max(1, Math.floor(maxParams / columns.length));
  const out: InStatement[] = [];
  for (let i = 0; i < rows.length; i += perStatement) {
    const chunk = rows.slice(i, i + perStatement) as Record<string, unknown>[];
    const args: InValue[] = [];
    for (const row of chunk) {
      columns.forEach((column, j) => {
        const v = row[keys[j]];
        args.push(v === undefined ? missing(column) : v === null ? null : (column.mapToDriverValue(v) as InValue));
      });
    }
    out.push({ sql: head + Array(chunk.length).fill(tuple).join(", "), args });
  }
  return out;
}
