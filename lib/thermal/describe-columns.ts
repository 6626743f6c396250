import { classifyColumns, type ColumnInfo } from "./columns";
import { decodeLoggerFile, type LoggerFileInput } from "./decode";
import { readTable, type DecimalSeparator, type Delimiter } from "./read-table";
import type { TimeFormat } from "./time";
import type { TemperatureUnit } from "./units";

export interface ColumnDescription {
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  timeColumn: string;
  timeFormat: TimeFormat;
  columns: ColumnInfo[];
  /** Probe names in file order. */
  probes: string[];
  setPointColumn: string | null;
  /** The unit the probe headers agree on, "mixed", or null when no header names one. */
  units: TemperatureUnit | "mixed" | null;
  /** Data rows in the file (blank lines not counted). */
  rows: number;
  preview: { header: string[]; rows: string[][] };
}

/**
 * What an upload wizard needs to show before analysis: the detected layout of a logger file.
 * Throws ThermalFileError only for files that cannot be read as a table at all.
 */
export function describeColumns(input: LoggerFileInput | Uint8Array | string, previewRows = 5): ColumnDescription {
  const normalised: LoggerFileInput =
    typeof input === "string" ? { text: input } : input instanceof Uint8Array ? { bytes: input } : input;
  const table = readTable(decodeLoggerFile(normalised));
  const layout = classifyColumns(table);
  const probes = layout.columns.filter((c) => c.role === "probe");
  const units = [...new Set(probes.map((p) => p.unit).filter((u): u is TemperatureUnit => u !== null))];
  return {
    delimiter: table.delimiter,
    decimalSeparator: table.decimalSeparator,
    timeColumn: table.header[layout.timeIndex],
    timeFormat: layout.timeFormat,
    columns: layout.columns,
    probes: probes.map((p) => p.name),
    setPointColumn: layout.columns.find((c) => c.role === "setPoint")?.header ?? null,
    units: units.length === 0 ? null : units.length === 1 ? units[0] : "mixed",
    rows: table.rows.length,
    preview: { header: table.header, rows: table.rows.slice(0, previewRows).map((r) => r.slice()) },
  };
}
