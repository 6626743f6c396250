import { createHash } from "node:crypto";
import type { Client } from "@libsql/client";

const TABLES = ["site", "line", "oven", "user", "run", "run_channel", "run_sample", "drift_state", "drift_point", "oven_health", "alert", "oven_change", "maintenance_plan", "work_order", "meter_reading"];

/** Rows per table of the large data set, and the ovens by health state. */
export async function tableCounts(client: Client) {
  const out: Record<string, number> = {};
  for (const t of TABLES) out[t] = Number((await client.execute(`select count(*) as n from "${t}"`)).rows[0].n);
  for (const r of (await client.execute("select state, count(*) as n from oven_health group by state order by state")).rows) out[`health: ${r.state}`] = Number(r.n);
  return out;
}

/**
 * A SHA-256 over the data that the seed decides (ids, ovens, times from the history's start,
 * metrics, verdicts, work-order states, drift results), not over what differs between runs by
 * design (user ids are random UUIDs; `updated_at` is the wall clock). Large tables go in by
 * per-oven sums, so the check stays quick.
 */
export async function largeFingerprint(client: Client, start: number) {
  const hash = createHash("sha256");
  const queries = [
    `select oven_id, count(*), min(id), max(id), sum(run_at - ${start}), sum(verdict_status = 'fail'), sum(verdict_status = 'marginal'), sum(calibration_status <> 'valid'),
       round(sum(delta_t_peak), 4), round(sum(critical_spread), 4), round(sum(tal_min), 4), round(sum(peak_min), 4), round(sum(heat_up_rate), 4) from run group by oven_id order by oven_id`,
    "select run_id / 1000, count(*), round(sum(peak), 3), round(sum(tal), 3) from run_channel group by 1 order by 1",
    "select run_id, length(\"values\"), hex(substr(\"values\", 1, 32)) from run_sample order by run_id",
    `select id, oven_id, at - ${start}, area, summary from oven_change order by id`,
    `select id, number, oven_id, kind, state, due_at - ${start}, completed_at - ${start}, assignee_id is null from work_order order by id`,
    "select oven_id, metric, round(json_extract(baseline, '$.mean'), 6), round(json_extract(baseline, '$.sigma'), 6), round(json_extract(state, '$.ewma.z'), 6), round(json_extract(state, '$.cusum.high'), 6) from drift_state order by oven_id, metric",
    "select oven_id, metric, count(*), round(sum(ewma), 4), sum(json_array_length(signals)) from drift_point group by oven_id, metric order by oven_id, metric",
    "select oven_id, state from oven_health order by oven_id",
  ];
  for (const q of queries) {
    const { rows } = await client.execute(q);
    for (const r of rows) hash.update(JSON.stringify(Object.values(r)) + "\n");
  }
  return hash.digest("hex").slice(0, 16);
}
