import type { ColumnInfo } from "./columns";
import { invalidFile } from "./errors";
import { parseDecimal } from "./numbers";
import type { DecimalSeparator } from "./read-table";
import { timeReader, type TimeFormat } from "./time";
import { timeHeaderScale, unitLabel, type TemperatureUnit } from "./units";

export const MAX_ROWS = 500_000;
const PLAUSIBLE_MIN_C = -273.15;
const PLAUSIBLE_MAX_C = 1800;

/** Raw cell value → °C, or null when the value has no temperature (e.g. outside a thermocouple range). */
export type Converter = (v: number) => number | null;

export interface ConvertedColumn {
  column: ColumnInfo;
  unit: TemperatureUnit;
  convert: Converter | null;
}

function preview(cell: string): string {
  const clean = cell.replace(/[\x00-\x1f\x7f]/g, " ").trim();
  return clean.length > 40 ? `${clean.slice(0, 40)}…` : clean;
}

function cellError(line: number, column: string, cell: string | undefined, what: string, decimal: DecimalSeparator) {
  if (cell === undefined || cell.trim() === "") {
    return invalidFile(
      `Row ${line}, column "${column}" is empty. Every sample row needs a value in every probe column; fill the gap or remove the row, then upload the file again.`,
      { row: line, column },
    );
  }
  const sep = decimal === "," ? "a decimal comma" : "a decimal point";
  return invalidFile(
    `Row ${line}, column "${column}": "${preview(cell)}" is not ${what}. Check the file's decimal separator (this file was read with ${sep}) and that the cell holds a plain number without text or units.`,
    { row: line, column },
  );
}

function implausible(line: number, c: ConvertedColumn, cell: string) {
  return invalidFile(
    `Row ${line}, column "${c.column.header}": ${preview(cell)} ${unitLabel(c.unit)} is not a plausible temperature${c.unit === "mV" ? " for this thermocouple type" : ""}. Check the unit and thermocouple type chosen for the file.`,
    { row: line, column: c.column.header },
  );
}

function grow(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}

/**
 * Turns data rows into a time axis (s from the first row, strictly increasing) and °C columns,
 * one row at a time, into typed arrays that grow as needed.
 */
export function rowConverter(options: {
  timeColumn: ColumnInfo;
  timeFormat: TimeFormat;
  columns: ConvertedColumn[];
  decimalSeparator: DecimalSeparator;
  capacity: number;
}) {
  const { timeColumn, timeFormat, columns, decimalSeparator } = options;
  const comma = decimalSeparator === ",";
  const m = columns.length;
  const indices = Int32Array.from(columns.map((c) => c.column.index));
  const converters = columns.map((c) => c.convert);
  const readTime = timeReader(timeFormat, comma, timeHeaderScale(timeColumn.header));
  const timeWhat = timeFormat === "seconds" ? "a time in seconds" : timeFormat === "datetime" ? "a date and time" : `a ${timeFormat} time`;
  let capacity = Math.max(16, Math.min(options.capacity, MAX_ROWS));
  let time: Float64Array = new Float64Array(capacity);
  let outs: Float64Array[] = columns.map(() => new Float64Array(capacity));
  let n = 0;
  let first = 0;

  function push(row: string[], line: number): void {
    if (n === capacity) {
      if (n >= MAX_ROWS) {
        throw invalidFile(`The file has more than ${MAX_ROWS} data rows. Export a shorter recording or a lower sampling rate.`, { rows: n + 1, limit: MAX_ROWS });
      }
      capacity = Math.min(capacity * 2, MAX_ROWS);
      time = grow(time, capacity);
      outs = outs.map((o) => grow(o, capacity));
    }
    const k = n;
    const timeCell = row[timeColumn.index];
    const raw = timeCell === undefined ? NaN : readTime(timeCell);
    if (!Number.isFinite(raw)) throw cellError(line, timeColumn.header, timeCell, timeWhat, decimalSeparator);
    if (k === 0) first = raw;
    const t = raw - first;
    if (k > 0 && !(t > time[k - 1])) {
      throw invalidFile(
        `Row ${line}: the time "${preview(timeCell!)}" does not come after the previous row's time. Times must increase from row to row; remove repeated or out-of-order rows and upload the file again.`,
        { row: line },
      );
    }
    time[k] = t;
    // Locals, not closure slots, in the loop that runs for every cell.
    const o = outs;
    const idx = indices;
    const conv = converters;
    for (let p = 0; p < m; p++) {
      const cell = row[idx[p]];
      const value = cell === undefined ? NaN : parseDecimal(cell, comma);
      if (value !== value) throw cellError(line, columns[p].column.header, cell, "a number", decimalSeparator);
      const convert = conv[p];
      const c = convert === null ? value : convert(value);
      if (c === null || !(c >= PLAUSIBLE_MIN_C && c <= PLAUSIBLE_MAX_C)) throw implausible(line, columns[p], cell!);
      o[p][k] = c;
    }
    n = k + 1;
  }

  function finish(): { time: Float64Array; values: Float64Array[] } {
    // Keep the buffers when they are nearly full; copy when the capacity guess was generous.
    const cut = (a: Float64Array) => (n >= capacity * 0.75 ? a.subarray(0, n) : a.slice(0, n));
    return { time: cut(time), values: outs.map(cut) };
  }

  return { push, finish, rows: () => n };
}
