// npm run bench:fleet — the fleet view's server time with 1 month and with 3 years of daily
// runs on 50 ovens (run summaries only). Prints medians and the ratio; targets: ratio < 1.5.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { lines, ovens, sites } from "../db/schema/fleet";
import { runs } from "../db/schema/runs";
import { refreshHealth } from "../db/queries/health";
import { fleetView } from "../db/queries/fleet-view";
import { DEFAULT_WINDOW } from "../lib/thermal/windows";

const DAY = 86_400_000;
const OVENS = 50;
const now = new Date(Math.floor(Date.now() / DAY) * DAY + 12 * 3_600_000);

async function scenario(days: number) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-bench-"));
  const { db, client } = await openDatabase(`file:${path.join(dir, "bench.db")}`);
  await migrateDatabase(db);
  const [site] = await db.insert(sites).values({ name: "Bench plant", timeZone: "Europe/Dublin" }).returning();
  const [line] = await db.insert(lines).values({ siteId: site.id, name: "Line" }).returning();
  const ovenRows = await db.insert(ovens).values(Array.from({ length: OVENS }, (_, i) => ({ tag: `B-${i + 1}`, name: `Bench oven ${i + 1}`, lineId: line.id, kind: "convection" as const, zones: 8 }))).returning();
  const rows = [];
  for (const o of ovenRows) {
    for (let d = days; d >= 1; d--) {
      const dt = 4 + Math.sin(d / 9 + o.id) * 0.5;
      rows.push({
        ovenId: o.id, runAt: new Date(now.getTime() - d * DAY), windowValues: DEFAULT_WINDOW, calibrationStatus: "valid" as const, offsetsApplied: {},
        rows: 421, durationSeconds: 420, sampleInterval: 1, units: "C", warnings: [], verdictStatus: "pass" as const, windowUse: 70, verdictItems: {},
        peakMin: 238, peakMax: 238 + dt, deltaTPeak: dt, criticalSpread: dt + 1, heatUpRate: 1.5, rampUpMax: 2.2, rampDownMax: 2.5,
        soakTimeMin: 90, soakTimeMax: 95, talMin: 55, talMax: 58, timeToPeakMax: 235,
      });
    }
  }
  for (let i = 0; i < rows.length; i += 1000) await db.insert(runs).values(rows.slice(i, i + 1000) as never);
  // Health (with the run summary the fleet view reads) as the app stores it after each run.
  for (const o of ovenRows) await db.transaction((tx) => refreshHealth(tx, o.id, now));
  for (let i = 0; i < 10; i++) await fleetView(db, {}, now); // warm-up
  const times: number[] = [];
  for (let i = 0; i < 20; i++) {
    const t = performance.now();
    const out = await fleetView(db, {}, now);
    times.push(performance.now() - t);
    if (out.length !== OVENS) throw new Error("fleet view lost ovens");
  }
  times.sort((a, b) => a - b);
  client.close();
  fs.rmSync(dir, { recursive: true, force: true });
  return { runs: rows.length, median: times[10], p95: times[18] };
}

await scenario(30); // warms the JIT and the query cache shapes, so the first figure is not the slowest
const month = await scenario(30);
const years = await scenario(3 * 365);
console.table([
  { history: "1 month", ovens: OVENS, runs: month.runs, "median ms": month.median.toFixed(1), "p95 ms": month.p95.toFixed(1) },
  { history: "3 years", ovens: OVENS, runs: years.runs, "median ms": years.median.toFixed(1), "p95 ms": years.p95.toFixed(1) },
]);
const ratio = years.median / month.median;
console.log(`3-year / 1-month median ratio: ${ratio.toFixed(2)} (target < 1.5) — ${ratio < 1.5 ? "met" : "NOT met"}; load ${os.loadavg().map((l) => l.toFixed(1)).join(", ")} on ${os.cpus().length} CPUs`);
