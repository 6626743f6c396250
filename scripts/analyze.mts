/**
 * Analyse a logger file from the command line.
 *   npm run analyze -- <file> [--window <presetId>] [--skew <s>] [--units C|F|mV] [--tc K|J|T]
 *                             [--cj <°C>] [--offsets <json>] [--set-point <column>] [--columns <a,b,…>] [--json]
 * --json prints the analysis result as the API returns it. Exit codes: 0 done, 1 usage or
 * option error, 2 the file cannot be analysed (its message is printed).
 */
import { readFileSync } from "node:fs";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { isThermalFileError } from "@/lib/thermal/errors";
import { toAnalyzeOptions } from "@/lib/thermal/options";
import type { AnalysisResult } from "@/lib/thermal/types";
import { unitLabel } from "@/lib/thermal/units";
import { DEFAULT_WINDOW_PRESET_ID, WINDOW_PRESETS } from "@/lib/thermal/windows";

const FLAGS: Record<string, string> = {
  "--window": "window", "--skew": "skewSeconds", "--units": "units", "--tc": "thermocouple",
  "--cj": "coldJunctionC", "--offsets": "offsets", "--set-point": "setPointColumn", "--columns": "columns",
};

const USAGE =
  "Usage: npm run analyze -- <file> [--window <presetId>] [--skew <s>] [--units C|F|mV] [--tc K|J|T] [--cj <°C>]\n" +
  "                              [--offsets <json>] [--set-point <column>] [--columns <a,b,…>] [--json]\n" +
  `Window presets: ${WINDOW_PRESETS.map((p) => p.id).join(", ")} (default ${DEFAULT_WINDOW_PRESET_ID}).`;

function fail(message: string, code: number): never {
  console.error(message);
  process.exit(code);
}

function parseArgs(argv: string[]) {
  const fields: Record<string, string> = {};
  let file: string | undefined;
  let json = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === "--json") json = true;
    else if (arg === "--help" || arg === "-h") fail(USAGE, 0);
    else if (arg in FLAGS) {
      const value = argv[++i];
      if (value === undefined) fail(`${arg} needs a value.\n${USAGE}`, 1);
      fields[FLAGS[arg]] = value;
    } else if (arg.startsWith("--")) fail(`Unknown option ${arg}.\n${USAGE}`, 1);
    else if (file === undefined) file = arg;
    else fail(`Only one file can be analysed at a time (got "${file}" and "${arg}").`, 1);
  }
  if (!file) fail(USAGE, 1);
  return { file, fields, json };
}

const num = (v: number | null | undefined, digits = 2) => (v === null || v === undefined ? "—" : v.toFixed(digits));

function printTables(file: string, result: AnalysisResult, presetId: string): void {
  const { meta, board, verdict } = result;
  console.log(`${file}: ${meta.channels} probes, ${meta.rows} rows, ${num(meta.durationSeconds, 1)} s, every ${num(meta.sampleInterval, 3)} s, read as ${unitLabel(meta.units)}` +
    (meta.thermocouple ? ` (type ${meta.thermocouple}, cold junction ${meta.coldJunctionC} °C)` : "") +
    `; window ${presetId}; scan skew ${meta.skewSeconds} s.`);
  if (Object.keys(meta.offsets).length > 0) console.log(`Calibration offsets (°C): ${JSON.stringify(meta.offsets)}`);
  console.log("\nProbes");
  console.table(result.channels.map((c) => ({
    probe: c.name, "peak °C": num(c.peak), "at s": num(c.timeAtPeak, 1), "TAL s": num(c.tal, 1),
    "heat-up °C/s": num(c.heatUpRate), "ramp up °C/s": num(c.rampUpMax), "ramp down °C/s": num(c.rampDownMax),
    "soak s": num(c.soakTime, 1), "to peak s": num(c.timeToPeak, 1),
  })));
  console.log("Board");
  const boardRows: Array<[string, number | null, string]> = [
    ["peak, lowest probe", board.peakMin, "°C"], ["peak, highest probe", board.peakMax, "°C"],
    ["ΔT at peak", board.deltaTPeak, "°C"], ["critical-phase spread", board.criticalSpread, "°C"],
    ["heat-up rate, slowest probe", board.heatUpRate, "°C/s"], ["ramp-up max", board.rampUpMax, "°C/s"],
    ["ramp-down max", board.rampDownMax, "°C/s"], ["soak time, shortest", board.soakTimeMin, "s"],
    ["soak time, longest", board.soakTimeMax, "s"], ["TAL, shortest", board.talMin, "s"],
    ["TAL, longest", board.talMax, "s"], ["time to peak, longest", board.timeToPeakMax, "s"],
  ];
  if (board.trackingError) {
    boardRows.push(["set-point tracking error, mean", board.trackingError.mean, "°C"], ["set-point tracking error, max", board.trackingError.max, "°C"]);
  }
  console.table(boardRows.map(([statistic, value, unit]) => ({ statistic, value: num(value), unit })));
  console.log(`Verdict: ${verdict.status.toUpperCase()}, window use ${num(verdict.windowUse, 1)} %`);
  console.table(Object.entries(verdict.items).map(([item, use]) => ({ item, "window use %": num(use, 1) })));
  for (const w of meta.warnings) console.log(`Warning: ${w}`);
}

const { file, fields, json } = parseArgs(process.argv.slice(2));
let options;
try {
  options = toAnalyzeOptions(fields);
} catch (error) {
  fail(isThermalFileError(error) ? `Option ${error.details.field}: ${error.message}` : String(error), 1);
}
let bytes: Uint8Array;
try {
  bytes = new Uint8Array(readFileSync(file));
} catch (error) {
  fail(`Cannot read ${file}: ${(error as Error).message}`, 1);
}
try {
  const result = analyzeLoggerFile({ bytes }, options);
  if (json) console.log(JSON.stringify(result, null, 2));
  else printTables(file, result, fields.window ?? DEFAULT_WINDOW_PRESET_ID);
} catch (error) {
  if (!isThermalFileError(error)) throw error;
  if (error.code === "invalid_options") fail(`Option ${error.details.field}: ${error.message}`, 1);
  fail(`${file}: ${error.message}`, 2);
}
