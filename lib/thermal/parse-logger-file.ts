import { classifyColumns, uniqueNames, type ColumnInfo } from "./columns";
import { MAX_ROWS, rowConverter, type ConvertedColumn, type Converter } from "./convert-rows";
import { decodeLoggerFile, type LoggerFileInput } from "./decode";
import { invalidFile, invalidOptions } from "./errors";
import { millivoltConverter, type ThermocoupleType } from "./its90";
import { parseDecimal } from "./numbers";
import { scanTable, type DecimalSeparator, type Delimiter, type TableHead } from "./read-table";
import type { TimeFormat } from "./time";
import { fahrenheitToCelsius, unitLabel, type TemperatureUnit } from "./units";

export { MAX_ROWS };
export const MAX_PROBES = 64;
export const MIN_ROWS = 10;
/** Columns are classified (time, probe, set point, ignored) from this many first data rows. */
export const CLASSIFY_ROWS = 1000;

export interface ParseOptions {
  units?: TemperatureUnit;
  thermocouple?: ThermocoupleType;
  coldJunctionC?: number;
  setPointColumn?: string;
  /** Probe columns to keep, by name or header, in this order. */
  columns?: string[];
}

export interface ProbeSeries {
  name: string;
  header: string;
  /** Position among the file's probe columns: the logger's scan order, used for skew. */
  scanIndex: number;
  /** °C. */
  values: Float64Array;
}

export interface ParsedLoggerFile {
  /** Seconds from the first data row. */
  time: Float64Array;
  channels: ProbeSeries[];
  setPoint?: { name: string; header: string; values: Float64Array };
  /** Unit the probe values were written in (values are returned in °C). */
  units: TemperatureUnit;
  timeFormat: TimeFormat;
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  /** Blank lines skipped. */
  rowsDropped: number;
  warnings: string[];
}

function checkOptions(options: ParseOptions): void {
  if (options.units !== undefined && !["C", "F", "mV"].includes(options.units)) {
    throw invalidOptions("units", `Units "${String(options.units)}" are not supported. Use C, F or mV.`);
  }
  if (options.thermocouple !== undefined && !["K", "J", "T"].includes(options.thermocouple)) {
    throw invalidOptions("thermocouple", `Thermocouple type "${String(options.thermocouple)}" is not supported. Use K, J or T.`);
  }
  const cj = options.coldJunctionC;
  if (cj !== undefined && !(typeof cj === "number" && cj >= -50 && cj <= 100)) {
    throw invalidOptions("coldJunctionC", "The cold-junction temperature must be a number of °C between -50 and 100.");
  }
}

function pickProbes(all: ColumnInfo[], wanted: string[] | undefined): ColumnInfo[] {
  if (!wanted) return all;
  const chosen: ColumnInfo[] = [];
  for (const w of wanted) {
    const key = w.trim().toLowerCase();
    const hit = all.find((c) => c.name.toLowerCase() === key) ?? all.find((c) => c.header.toLowerCase() === key);
    if (!hit) {
      throw invalidOptions("columns", `Column "${w}" is not a probe column of this file. Probe columns: ${all.map((c) => `"${c.name}"`).join(", ")}.`);
    }
    if (chosen.includes(hit)) throw invalidOptions("columns", `Column "${w}" is listed twice. List each probe column once.`);
    chosen.push(hit);
  }
  if (chosen.length === 0) throw invalidOptions("columns", "The column list is empty. Pick at least one probe column.");
  return chosen;
}

function probeUnits(probes: ColumnInfo[], options: ParseOptions, warnings: string[]): TemperatureUnit {
  const found = [...new Set(probes.map((p) => p.unit).filter((u): u is TemperatureUnit => u !== null))];
  if (options.units) {
    const other = found.filter((u) => u !== options.units);
    if (other.length > 0) warnings.push(`The headers name ${other.map(unitLabel).join(", ")}; the probes were read as ${unitLabel(options.units)} as chosen.`);
    return options.units;
  }
  if (found.length > 1) {
    throw invalidFile(
      `The probe columns use different units (${found.map(unitLabel).join(", ")}). Export every probe in one unit, or choose the unit when uploading.`,
      { units: found.join(",") },
    );
  }
  if (found.length === 1) return found[0];
  warnings.push("No unit found in the probe column headers; temperatures were read as °C.");
  return "C";
}

function converterFor(unit: TemperatureUnit, options: ParseOptions): Converter | null {
  if (unit === "F") return fahrenheitToCelsius;
  if (unit === "mV") return millivoltConverter(options.thermocouple ?? "K", options.coldJunctionC ?? 0);
  return null;
}

/** Rows to expect, from the file length and the first rows' length (a starting size for the arrays). */
function expectedRows(textLength: number, head: TableHead): number {
  let chars = 0;
  for (const row of head.rows) for (const cell of row) chars += cell.length + 1;
  return Math.ceil((textLength / Math.max(1, chars / Math.max(1, head.rows.length))) * 1.05) + 16;
}

function checkHead(head: TableHead): void {
  const { header, headerLine } = head;
  if (header.every((h) => h === "")) {
    throw invalidFile(`Row ${headerLine}, the header row, names no columns. Add a header row naming the time column and each probe, then upload the file again.`, { row: headerLine });
  }
  if (header.every((h) => h === "" || !Number.isNaN(parseDecimal(h, head.decimalSeparator === ",")))) {
    throw invalidFile(`Row ${headerLine} holds numbers, not column names. Add a header row naming the time column and each probe, then upload the file again.`, { row: headerLine });
  }
  if (head.complete && head.rows.length < MIN_ROWS) {
    const n = head.rows.length;
    throw invalidFile(`The file has ${n} data row${n === 1 ? "" : "s"}; a run needs at least ${MIN_ROWS}. Upload the complete recording.`, { rows: n, limit: MIN_ROWS });
  }
}

/** Reads a logger file into °C series on a time axis in seconds from the first row. */
export function parseLoggerFile(input: LoggerFileInput, options: ParseOptions = {}): ParsedLoggerFile {
  checkOptions(options);
  const warnings: string[] = [];
  const text = decodeLoggerFile(input);
  let result: Omit<ParsedLoggerFile, "time" | "channels" | "setPoint" | "delimiter" | "rowsDropped" | "warnings"> | undefined;
  let converter: ReturnType<typeof rowConverter> | undefined;
  let probes: ColumnInfo[] = [];
  let allProbes: ColumnInfo[] = [];
  let spColumn: ColumnInfo | undefined;

  const scan = scanTable(text, CLASSIFY_ROWS, (head) => {
    checkHead(head);
    const layout = classifyColumns(head, options.setPointColumn);
    for (const c of layout.columns) {
      if (c.role !== "ignored" || c.note !== "holds no numbers") continue;
      const where = head.complete ? "" : ` in its first ${CLASSIFY_ROWS} rows`;
      warnings.push(`Column "${c.header}" holds no numbers${where} and was not read as a probe.`);
    }
    spColumn = layout.columns.find((c) => c.role === "setPoint");
    if (options.setPointColumn !== undefined && !spColumn) {
      throw invalidOptions("setPointColumn", `Set-point column "${options.setPointColumn}" is not one of the file's columns (the time column cannot be the set point). Pick one of its column headers.`);
    }
    allProbes = layout.columns.filter((c) => c.role === "probe");
    if (allProbes.length === 0) {
      throw invalidFile(`No probe columns found: besides the time column "${head.header[layout.timeIndex]}", no column with a header holds numbers. The file needs one column per probe with a header such as "TC1 (°C)".`, { columns: head.header.length });
    }
    if (allProbes.length > MAX_PROBES) {
      throw invalidFile(`The file has ${allProbes.length} probe columns; at most ${MAX_PROBES} are accepted. Remove unused channels from the export.`, { probes: allProbes.length, limit: MAX_PROBES });
    }
    probes = pickProbes(allProbes, options.columns);
    const units = probeUnits(probes, options, warnings);
    const convert = converterFor(units, options);
    const columns: ConvertedColumn[] = probes.map((column) => ({ column, unit: units, convert }));
    if (spColumn) {
      // A set point is a temperature: if probes are millivolts, an unlabelled set point is °C.
      const spUnit = spColumn.unit ?? (units === "mV" ? "C" : units);
      columns.push({ column: spColumn, unit: spUnit, convert: converterFor(spUnit, options) });
    }
    result = { units, timeFormat: layout.timeFormat, decimalSeparator: head.decimalSeparator };
    converter = rowConverter({
      timeColumn: layout.columns[layout.timeIndex],
      timeFormat: layout.timeFormat,
      columns,
      decimalSeparator: head.decimalSeparator,
      capacity: head.complete ? head.rows.length : expectedRows(text.length, head),
    });
    return converter.push;
  });

  const { time, values } = converter!.finish();
  const names = uniqueNames(probes.map((p) => p.name));
  const channels = probes.map((p, i) => ({ name: names[i], header: p.header, scanIndex: allProbes.indexOf(p), values: values[i] }));
  const setPoint = spColumn ? { name: spColumn.name, header: spColumn.header, values: values[probes.length] } : undefined;
  return { ...result!, time, channels, setPoint, delimiter: scan.delimiter, rowsDropped: scan.blankLines, warnings };
}
