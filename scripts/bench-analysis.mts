/**
 * Benchmark of logger-file analysis. Generates two files deterministically, then times
 * papaparse alone (same config as the analysis) against the full analyzeLoggerFile.
 *   npm run bench:analysis
 * Targets: 16-probe 10 Hz 60-minute file ≤ 2 × parse alone and < 400 ms; 8-probe 1 Hz 7-minute file < 10 ms.
 */
import Papa from "papaparse";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { detectDelimiter, scanConfig } from "@/lib/thermal/read-table";
import { runToCsv, simulateReflowRun } from "@/lib/thermal/synthetic-profile";

const WARM_UP = 3;
const RUNS = 7;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[s.length >> 1];
}

function time(fn: () => unknown): number[] {
  for (let i = 0; i < WARM_UP; i++) fn();
  const out: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    fn();
    out.push(performance.now() - start);
  }
  return out;
}

const cases = [
  { label: "8 probes, 1 Hz, 7 min", probes: 8, hz: 1, seconds: 420, seed: 1, limitMs: 10, maxRatio: Infinity },
  { label: "16 probes, 10 Hz, 60 min", probes: 16, hz: 10, seconds: 3600, seed: 2, limitMs: 400, maxRatio: 2 },
];

let allMet = true;
const rows = cases.map((c) => {
  const text = runToCsv(simulateReflowRun({ probes: c.probes, sampleHz: c.hz, durationSeconds: c.seconds, seed: c.seed }));
  const bytes = new TextEncoder().encode(text);
  // The analysis parses quote-free files in chunks; time papaparse alone with that same configuration.
  const config = scanConfig(text, detectDelimiter(text), () => {});
  const parseMs = median(time(() => Papa.parse(text, config as Papa.ParseConfig<string[]>)));
  let result: ReturnType<typeof analyzeLoggerFile> | undefined;
  const analysisMs = median(time(() => { result = analyzeLoggerFile({ bytes }); }));
  const ratio = analysisMs / parseMs;
  const met = analysisMs < c.limitMs && ratio <= c.maxRatio;
  allMet &&= met;
  return {
    file: c.label,
    MB: +(bytes.length / 1024 / 1024).toFixed(2),
    rows: result!.meta.rows,
    "papaparse ms": +parseMs.toFixed(2),
    "analysis ms": +analysisMs.toFixed(2),
    ratio: +ratio.toFixed(2),
    target: c.maxRatio === Infinity ? `< ${c.limitMs} ms` : `< ${c.limitMs} ms and ≤ ${c.maxRatio}×`,
    met: met ? "yes" : "NO",
  };
});

console.log(`Median of ${RUNS} runs after ${WARM_UP} warm-up runs; Node ${process.version}.`);
console.table(rows);
if (!allMet) {
  console.log("Some targets were not met.");
  process.exitCode = 1;
}
