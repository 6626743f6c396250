// npm run bench [-- --duration <s>] [--connections <n>] [--samples <n>] [--only demo|large] [--load large|demo|both|none] [--port <n>]
//
// Server time of the main reads and of a run upload, through the HTTP API of the production
// build, on a fresh demo database and on a copy of the large one (npm run seed:large; the copy
// keeps the seeded file as it was). Each request is sent alone, after a warm-up; the figures are
// the app's own time (its Server-Timing header: authentication, queries, the JSON answer) and
// the round trip seen by this script. Then a mixed read/write load from autocannon (50
// connections for 60 s by default; --duration 10 for a quick check). Builds the app when there
// is no build. The machine's load is printed beside the figures: other work moves them.
// LARGE_DATABASE_URL names another large database than file:./data/large.db; BENCH_PORT (or
// --port) the port the app is started on, one data set at a time.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import type { Timings } from "./bench-support/requests";

const { values: args } = parseArgs({
  options: {
    duration: { type: "string", default: "60" },
    connections: { type: "string", default: "50" },
    samples: { type: "string", default: "100" },
    only: { type: "string" },
    load: { type: "string", default: "large" },
    port: { type: "string", default: process.env.BENCH_PORT ?? "3400" },
  },
});
const duration = Number(args.duration);
const connections = Number(args.connections);
const samples = Number(args.samples);
const port = Number(args.port);
if (![duration, connections, samples, port].every((n) => Number.isInteger(n) && n > 0)) {
  console.error("--duration, --connections, --samples and --port take whole numbers above 0.");
  process.exit(2);
}
if (args.only && !["demo", "large"].includes(args.only)) {
  console.error("--only takes demo or large.");
  process.exit(2);
}
if (!["large", "demo", "both", "none"].includes(args.load!)) {
  console.error("--load takes large, demo, both or none.");
  process.exit(2);
}

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-bench-"));
// The demo seed writes its sample files through the app's file store, which reads UPLOAD_DIR once.
process.env.UPLOAD_DIR = path.join(dir, "uploads");
const { ensureBuild, startServer } = await import("./bench-support/server");
const { copyOf, fixtures, freshDemo } = await import("./bench-support/databases");
const { loggerCsv, percentile, timeRequests } = await import("./bench-support/requests");
const { mixedLoad } = await import("./bench-support/load");

const largeSource = process.env.LARGE_DATABASE_URL ?? "file:./data/large.db";
if (args.only !== "demo" && !fs.existsSync(largeSource.replace(/^file:/, ""))) {
  console.error(`There is no large database at ${largeSource}. Run "npm run seed:large" first (a few minutes), or "npm run bench -- --only demo".`);
  process.exit(2);
}
ensureBuild();

const sets: { name: "demo" | "large"; url: string }[] = [];
if (args.only !== "large") {
  console.log("Seeding a fresh demo database…");
  sets.push({ name: "demo", url: await freshDemo(dir) });
}
if (args.only !== "demo") sets.push({ name: "large", url: copyOf(largeSource, dir) });

type Measure = { key: string; label: string; target: string; p95Limit: number | null };
const MEASURES: Measure[] = [
  { key: "fleet", label: "fleet view (every oven)", target: "p95 < 100 ms", p95Limit: 100 },
  { key: "site", label: "fleet view, first site only", target: "—", p95Limit: null },
  { key: "trend", label: "an oven's ΔT trend, whole history", target: "p95 < 100 ms", p95Limit: 100 },
  { key: "runs", label: "runs list, first page of 25", target: "p95 < 100 ms", p95Limit: 100 },
  { key: "orders", label: "work-order list, first page of 50", target: "p95 < 100 ms", p95Limit: 100 },
  { key: "upload", label: "run upload (7 min, 8 probes, 1 Hz)", target: "—", p95Limit: null },
];
const results: Record<string, Record<string, Timings>> = {};
const described: string[] = [];
const loads: { name: string; result: Awaited<ReturnType<typeof mixedLoad>>; cpuMs: number | null }[] = [];

for (const set of sets) {
  const fx = await fixtures(set.url);
  described.push(`${set.name}: ${fx.ovens} ovens (${fx.siteOvens} on the first site), ${fx.runs} runs, ${fx.workOrders} work orders`);
  console.log(`Starting the app on the ${set.name} data (${fx.ovens} ovens, ${fx.runs} runs)…`);
  const server = await startServer({ databaseUrl: set.url, port, uploadDir: path.join(dir, `uploads-${set.name}`) });
  try {
    const auth = { authorization: `Bearer ${fx.token}` };
    const get = (p: string) => () => ({ url: server.base + p, init: { headers: auth } });
    const r: Record<string, Timings> = {};
    r.fleet = await timeRequests(samples, 10, get("/api/v1/fleet"));
    r.site = await timeRequests(samples, 10, get(`/api/v1/fleet?siteId=${fx.siteId}`));
    r.trend = await timeRequests(samples, 10, get(`/api/v1/ovens/${fx.trendOvenId}/trends?metric=deltaTPeak`));
    r.runs = await timeRequests(samples, 10, get("/api/v1/runs"));
    r.orders = await timeRequests(samples, 10, get("/api/v1/work-orders"));
    // Every upload a different file, recorded now: each is the oven's newest run (one drift step).
    const files = Array.from({ length: Math.min(samples, 40) + 5 }, (_, i) => loggerCsv(9000 + i));
    r.upload = await timeRequests(files.length - 5, 5, (i) => {
      const form = new FormData();
      form.set("file", new File([files[i]], `bench-${i}.csv`, { type: "text/csv" }));
      form.set("startState", "hot");
      if (fx.instrumentId) form.set("instrumentId", String(fx.instrumentId));
      return { url: `${server.base}/api/v1/ovens/${fx.uploadOvenId}/runs`, init: { method: "POST", headers: auth, body: form } };
    });
    results[set.name] = r;
    if (args.load === "both" || args.load === set.name) {
      console.log(`Mixed load on the ${set.name} data: ${connections} connections for ${duration} s…`);
      const cpuBefore = server.cpuMs();
      const result = await mixedLoad(server.base, fx, { connections, duration });
      const cpuAfter = server.cpuMs();
      loads.push({ name: set.name, result, cpuMs: cpuBefore === null || cpuAfter === null ? null : cpuAfter - cpuBefore });
    }
  } finally {
    await server.stop();
  }
}
fs.rmSync(dir, { recursive: true, force: true });

const f = (x: number | undefined) => (x === undefined ? "—" : x.toFixed(1));
console.log(`\nOvenward benchmark — ${new Date().toISOString()}, Node ${process.version}, ${os.cpus().length} CPUs, load average ${os.loadavg().map((l) => l.toFixed(1)).join(", ")}`);
for (const d of described) console.log(`  ${d}`);
console.log("\nServer time (the app's Server-Timing), ms, one request at a time:");
console.table(
  MEASURES.map((m) => {
    const demo = results.demo?.[m.key];
    const large = results.large?.[m.key];
    const p95 = large ? percentile(large.server, 95) : undefined;
    return {
      measure: m.label, n: (large ?? demo)?.server.length,
      "demo median": f(demo && percentile(demo.server, 50)), "demo p95": f(demo && percentile(demo.server, 95)),
      "large median": f(large && percentile(large.server, 50)), "large p95": f(p95),
      "target (large)": m.target, met: m.p95Limit === null || p95 === undefined ? "—" : p95 < m.p95Limit ? "yes" : "NO",
    };
  }),
);
console.log("Round trip seen by the client, ms (median / p95):");
console.table(
  MEASURES.map((m) => ({
    measure: m.label,
    ...Object.fromEntries(Object.entries(results).map(([name, r]) => [name, `${f(percentile(r[m.key].wall, 50))} / ${f(percentile(r[m.key].wall, 95))}`])),
  })),
);
if (results.demo && results.large) {
  const ratio = percentile(results.large.fleet.server, 50) / percentile(results.demo.fleet.server, 50);
  const ratio95 = percentile(results.large.fleet.server, 95) / percentile(results.demo.fleet.server, 95);
  console.log(`Fleet view large/demo ratio: median ${ratio.toFixed(2)}, p95 ${ratio95.toFixed(2)} (target < 2) — ${ratio < 2 ? "met" : "NOT met"}`);
}
for (const { name, result: r, cpuMs } of loads) {
  console.log(`\nMixed load on the ${name} data (${connections} connections, ${r.duration} s; 4 reads and 2 writes per round):`);
  console.table([
    {
      "requests": r.requests.total, "req/s (mean)": r.requests.average.toFixed(1), "latency p50 ms": r.latency.p50, "p90": r.latency.p90, "p99": r.latency.p99, "max": r.latency.max,
      "2xx": r["2xx"], "non-2xx": r.non2xx, errors: r.errors, timeouts: r.timeouts,
    },
  ]);
  console.log(`  status codes: ${Object.entries(r.statusCodeStats).map(([code, s]) => `${code} × ${s.count}`).join(", ")}`);
  if (cpuMs !== null) {
    // The app is one Node process: its CPU per request bounds what one core can serve, whatever the machine's load.
    const per = cpuMs / Math.max(1, r.requests.total);
    console.log(`  the app's CPU time: ${(cpuMs / 1000).toFixed(1)} s, ${per.toFixed(1)} ms per request (one core serves about ${(1000 / per).toFixed(0)} req/s of this mix)`);
  }
}
