/**
 * Benchmark of logger-file analysis. Generates two files deterministically, then times
 * papaparse alone against the full analyzeLoggerFile (from bytes, as an upload arrives).
 *   npm run bench:analysis
 * Targets: 16-probe 10 Hz 60-minute file ≤ 2 × papaparse alone and < 400 ms; 8-probe 1 Hz 7-minute file < 10 ms.
 * "papaparse alone" uses the configuration the analysis uses (scanConfig: chunks of 64 K characters
 * for files without quotes); a whole-text parse is printed beside it for comparison. Parse and
 * analysis runs alternate, so a busy machine slows both alike; the figures are medians. The load
 * average is printed because other work on the machine moves these figures a lot.
 */
import { cpus, loadavg } from "node:os";
import Papa from "papaparse";
import { analyzeLoggerFile } from "@/lib/thermal/analyze";
import { detectDelimiter, papaConfig, scanConfig } from "@/lib/thermal/read-table";
import { runToCsv, simulateReflowRun } from "@/lib/thermal/synthetic-profile";

// Warm up until the JIT has settled (at least 3 rounds and 300 ms), then time at least 9 rounds
// and 500 ms; report medians.
const WARM_UP_MS = 300;
const MIN_RUNS = 9;
const RUN_MS = 500;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[s.length >> 1];
}

/** Runs the functions in turn, round after round; returns each one's median in ms and the rounds timed. */
function timeInTurn(fns: Array<() => unknown>): { medians: number[]; runs: number } {
  const warmStart = performance.now();
  for (let i = 0; i < 3 || performance.now() - warmStart < WARM_UP_MS; i++) for (const fn of fns) fn();
  const samples = fns.map(() => [] as number[]);
  const runStart = performance.now();
  for (let i = 0; i < MIN_RUNS || performance.now() - runStart < RUN_MS; i++) {
    fns.forEach((fn, k) => {
      const start = performance.now();
      fn();
      samples[k].push(performance.now() - start);
    });
  }
  return { medians: samples.map(median), runs: samples[0].length };
}

const cases = [
  { label: "8 probes, 1 Hz, 7 min", probes: 8, hz: 1, seconds: 420, seed: 1, limitMs: 10, maxRatio: Infinity },
  { label: "16 probes, 10 Hz, 60 min", probes: 16, hz: 10, seconds: 3600, seed: 2, limitMs: 400, maxRatio: 2 },
];

let allMet = true;
const rows = cases.map((c) => {
  const text = runToCsv(simulateReflowRun({ probes: c.probes, sampleHz: c.hz, durationSeconds: c.seconds, seed: c.seed }));
  const bytes = new TextEncoder().encode(text);
  const delimiter = detectDelimiter(text);
  const used = scanConfig(text, delimiter, () => {}) as Papa.ParseConfig<string[]>;
  const whole = papaConfig(delimiter);
  let result: ReturnType<typeof analyzeLoggerFile> | undefined;
  const { medians, runs } = timeInTurn([
    () => Papa.parse(text, used),
    () => Papa.parse(text, whole),
    () => { result = analyzeLoggerFile({ bytes }); },
  ]);
  const [parseMs, wholeMs, analysisMs] = medians;
  const ratio = analysisMs / parseMs;
  const met = analysisMs < c.limitMs && ratio <= c.maxRatio;
  allMet &&= met;
  return {
    file: c.label,
    MB: +(bytes.length / 1024 / 1024).toFixed(2),
    rows: result!.meta.rows,
    runs,
    "papaparse ms": +parseMs.toFixed(2),
    "(whole-text parse ms)": +wholeMs.toFixed(2),
    "analysis ms": +analysisMs.toFixed(2),
    ratio: +ratio.toFixed(2),
    target: c.maxRatio === Infinity ? `< ${c.limitMs} ms` : `< ${c.limitMs} ms, ≤ ${c.maxRatio}×`,
    met: met ? "yes" : "NO",
  };
});

console.log(`Medians after warm-up; Node ${process.version}; load average ${loadavg().map((x) => x.toFixed(2)).join(", ")} on ${cpus().length} CPUs.`);
console.table(rows);
if (!allMet) {
  console.log("Some targets were not met.");
  process.exitCode = 1;
}
