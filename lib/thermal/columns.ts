import { parseDecimal } from "./numbers";
import type { RawTable } from "./read-table";

/** What classification needs: the header and (the first) data rows. */
export type ColumnSource = Pick<RawTable, "header" | "rows" | "decimalSeparator">;
import { detectTimeFormat, type TimeFormat } from "./time";
import { headerUnit, type TemperatureUnit } from "./units";

export type ColumnRole = "time" | "probe" | "setPoint" | "ignored";

export interface ColumnInfo {
  /** 0-based position in the file. */
  index: number;
  header: string;
  /** Header without its unit, e.g. "TC1" for "TC1 (°C)". */
  name: string;
  role: ColumnRole;
  unit: TemperatureUnit | null;
  /** Why a column is not a probe (for the upload wizard). */
  note?: string;
}

export interface ColumnLayout {
  columns: ColumnInfo[];
  timeIndex: number;
  timeFormat: TimeFormat;
}

const TIME_HEADER = /time|zeit|date|datum|elapsed|clock|seconds|^secs?\b|^t\b|^s\b/i;
// Sample counters hold numbers too, but they are not temperatures.
const INDEX_HEADER = /^(no\.?|nr\.?|num(ber)?|#|index|idx|row|record|rec|sample|sample ?(no\.?|#|number|nr\.?)|point|pt)$/i;
const SET_POINT_HEADER = /\bset/i;

function holdsNumbers(table: ColumnSource, index: number, decimalComma: boolean): boolean {
  const rows = table.rows;
  for (let r = 0; r < rows.length; r++) {
    const cell = rows[r][index];
    if (cell !== undefined && !Number.isNaN(parseDecimal(cell, decimalComma))) return true;
  }
  return false;
}

function sameName(a: string, b: string): boolean {
  return a.trim().toLowerCase() === b.trim().toLowerCase();
}

/** Which column is time, which are probes, which is the set point, and which are ignored. */
export function classifyColumns(table: ColumnSource, setPointColumn?: string): ColumnLayout {
  const decimalComma = table.decimalSeparator === ",";
  const parsedHeaders = table.header.map(headerUnit);
  let timeIndex = table.header.findIndex((h, i) => h !== "" && parsedHeaders[i].unit === null && TIME_HEADER.test(h));
  if (timeIndex === -1) timeIndex = 0;
  const firstTimeCell = table.rows.length > 0 ? (table.rows[0][timeIndex] ?? "") : "";
  const timeFormat = detectTimeFormat(firstTimeCell);

  let setPointIndex = -1;
  if (setPointColumn !== undefined) {
    setPointIndex = table.header.findIndex((h, i) => i !== timeIndex && (sameName(h, setPointColumn) || sameName(parsedHeaders[i].name, setPointColumn)));
  } else {
    setPointIndex = table.header.findIndex(
      (h, i) => i !== timeIndex && SET_POINT_HEADER.test(h) && holdsNumbers(table, i, decimalComma),
    );
  }

  const columns: ColumnInfo[] = table.header.map((header, index) => {
    const { unit, name } = parsedHeaders[index];
    const base = { index, header, name, unit };
    if (index === timeIndex) return { ...base, role: "time", unit: null };
    if (index === setPointIndex) return { ...base, role: "setPoint" };
    if (header === "") return { ...base, role: "ignored", note: "empty header" };
    if (INDEX_HEADER.test(header)) return { ...base, role: "ignored", note: "sample counter" };
    if (!holdsNumbers(table, index, decimalComma)) return { ...base, role: "ignored", note: "holds no numbers" };
    return { ...base, role: "probe" };
  });
  return { columns, timeIndex, timeFormat };
}

/** Probe names must be unique: a repeated name gets " (2)", " (3)" … */
export function uniqueNames(names: string[]): string[] {
  const seen = new Map<string, number>();
  return names.map((name) => {
    const key = name.toLowerCase();
    const count = (seen.get(key) ?? 0) + 1;
    seen.set(key, count);
    return count === 1 ? name : `${name} (${count})`;
  });
}
