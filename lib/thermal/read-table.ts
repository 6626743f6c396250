import Papa from "papaparse";
import { invalidFile } from "./errors";

export type Delimiter = "," | ";" | "\t";
export type DecimalSeparator = "." | ",";

/** The papaparse settings for logger files: strings only, one header row handled by us, blank lines kept for line numbers. */
export function papaConfig(delimiter: Delimiter): Papa.ParseConfig {
  return { delimiter, header: false, dynamicTyping: false, skipEmptyLines: false, quoteChar: '"' };
}

export interface RawTable {
  header: string[];
  /** Data rows in file order, blank lines removed. */
  rows: string[][];
  /**
   * 1-based line number in the file of each data row (the header is line `headerLine`). Counted
   * as papaparse rows, which equal lines unless a quoted cell holds a line break.
   */
  lineNumbers: Int32Array;
  headerLine: number;
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  blankLines: number;
}

const CANDIDATES: readonly Delimiter[] = ["\t", ";", ","];

function countOutsideQuotes(line: string, ch: string): number {
  let count = 0;
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (c === '"') quoted = !quoted;
    else if (c === ch && !quoted) count++;
  }
  return count;
}

/**
 * Tab, semicolon or comma: the candidate that splits the header into at least two fields and
 * gives the most of the first lines the header's field count; ties go to tab, then semicolon
 * (a semicolon file may hold decimal commas, a comma file cannot hold unquoted ones).
 */
export function detectDelimiter(text: string): Delimiter {
  const lines = text.slice(0, 65536).split(/\r\n|\n|\r/).filter((l) => l.trim() !== "").slice(0, 30);
  if (lines.length === 0) return ",";
  let best: Delimiter = ",";
  let bestScore = -1;
  for (const candidate of CANDIDATES) {
    const headerCount = countOutsideQuotes(lines[0], candidate);
    if (headerCount === 0) continue;
    let score = 0;
    for (const line of lines) if (countOutsideQuotes(line, candidate) === headerCount) score++;
    if (score > bestScore) { best = candidate; bestScore = score; }
  }
  return best;
}

const COMMA_NUMBER = /^\s*[-+]?\d*,\d+\s*$/;
const POINT_NUMBER = /^\s*[-+]?\d*\.\d+(?:[eE][-+]?\d+)?\s*$/;

/** Decimal comma when more cells look like "12,5" than like "12.5" (a stray point then fails as a cell error). */
export function detectDecimalSeparator(rows: string[][]): DecimalSeparator {
  let comma = 0;
  let point = 0;
  const limit = Math.min(rows.length, 200);
  for (let r = 0; r < limit; r++) {
    const row = rows[r];
    for (let c = 0; c < row.length; c++) {
      if (COMMA_NUMBER.test(row[c])) comma++;
      else if (POINT_NUMBER.test(row[c])) point++;
    }
  }
  return comma > point ? "," : ".";
}

function isBlank(row: string[]): boolean {
  for (let i = 0; i < row.length; i++) if (row[i].trim() !== "") return false;
  return true;
}

/** The header and the first data rows, enough to classify the columns. */
export interface TableHead {
  header: string[];
  headerLine: number;
  /** The first data rows (up to the lookahead), blank lines removed. */
  rows: string[][];
  lineNumbers: number[];
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  /** True when `rows` holds every data row of the file. */
  complete: boolean;
}

/** Receives each data row (in file order, the head's rows included) with its 1-based line number. */
export type RowSink = (row: string[], line: number) => void;

export interface TableScan {
  dataRows: number;
  blankLines: number;
  delimiter: Delimiter;
}

// Files without quotes are parsed in chunks, so each chunk's row arrays die young and the garbage
// collector never copies the whole table. A quote may span chunks, so quoted files are parsed whole.
const CHUNK_CHARS = 1 << 16;

/** The papaparse configuration scanTable uses for this text (also used by the benchmark). */
export type ScanConfig = Papa.ParseConfig<string[]> & { chunkSize?: number; chunk?: (results: Papa.ParseResult<string[]>) => void };

export function scanConfig(text: string, delimiter: Delimiter, chunk: (results: Papa.ParseResult<string[]>) => void): ScanConfig {
  if (text.indexOf('"') !== -1) return papaConfig(delimiter) as ScanConfig;
  return { ...papaConfig(delimiter), chunkSize: CHUNK_CHARS, chunk } as ScanConfig;
}

/**
 * One papaparse pass over the text. The header and the first `lookahead` data rows are handed to
 * `begin`, which classifies the columns and returns a sink; every data row then goes to the sink.
 * Line numbers count papaparse rows, which equal lines unless a quoted cell holds a line break.
 */
export function scanTable(text: string, lookahead: number, begin: (head: TableHead) => RowSink): TableScan {
  const delimiter = detectDelimiter(text);
  let index = 0;
  let header: string[] | null = null;
  let headerLine = 0;
  let blankLines = 0;
  let dataRows = 0;
  const rows: string[][] = [];
  const lines: number[] = [];
  let sink: RowSink | null = null;
  const start = (complete: boolean) => {
    const decimalSeparator = detectDecimalSeparator(rows);
    const begun = begin({ header: header!, headerLine, rows, lineNumbers: lines, delimiter, decimalSeparator, complete });
    for (let i = 0; i < rows.length; i++) begun(rows[i], lines[i]);
    sink = begun;
  };
  const feed = (data: string[][], errors: Papa.ParseError[]) => {
    const unclosed = errors.find((e) => e.code === "MissingQuotes");
    if (unclosed) {
      const line = index + (unclosed.row ?? 0) + 1;
      throw invalidFile(
        `Row ${line} opens a quoted field that is never closed. Remove the stray quote character (") or close it, then upload the file again.`,
        { row: line },
      );
    }
    for (let i = 0; i < data.length; i++) {
      const row = data[i];
      // Cheap test first: most blank lines are the file's trailing newline.
      if ((row.length === 1 && row[0].trim() === "") || (row[0].trim() === "" && isBlank(row))) {
        blankLines++;
        continue;
      }
      const line = index + i + 1;
      if (header === null) {
        header = row.map((cell) => cell.trim());
        headerLine = line;
        continue;
      }
      dataRows++;
      if (sink) sink(row, line);
      else {
        rows.push(row);
        lines.push(line);
        if (rows.length >= lookahead) start(false);
      }
    }
    index += data.length;
  };
  const config = scanConfig(text, delimiter, (results) => feed(results.data, results.errors));
  if (config.chunk) Papa.parse(text, config as Papa.ParseConfig<string[]>);
  else {
    const parsed = Papa.parse<string[]>(text, config);
    feed(parsed.data, parsed.errors);
  }
  if (header === null) throw invalidFile("The file is empty. Upload the logger's export: a header row, then one row per sample.");
  if (!sink) start(true);
  return { dataRows, blankLines, delimiter };
}

/** Header and every data row in memory (for describing a file; analysis streams instead). */
export function readTable(text: string): RawTable {
  let head: TableHead | null = null;
  const scan = scanTable(text, Infinity, (h) => {
    head = h;
    return () => {};
  });
  const h = head! as TableHead;
  return {
    header: h.header,
    rows: h.rows,
    lineNumbers: Int32Array.from(h.lineNumbers),
    headerLine: h.headerLine,
    delimiter: scan.delimiter,
    decimalSeparator: h.decimalSeparator,
    blankLines: scan.blankLines,
  };
}
