import "server-only";
import { and, asc, gte, inArray, isNull, sql } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { ovens } from "../schema/fleet";
import { runs } from "../schema/runs";
import type { OvenRunSummary } from "../schema/drift";

const DAY = 86_400_000;

/**
 * What the fleet view shows of each oven's runs: the latest run (not one dated more than a
 * minute ahead) and the ΔT of every run of the last 30 days, oldest first. A fixed handful of
 * statements for any number of ovens. Stored with the oven's health at each refresh (every new
 * or deleted run refreshes it), so the fleet view reads one row per oven; the view computes it
 * here only for an oven whose health has not been refreshed since the summary was added.
 */
export async function runSummaries(db: DbOrTx, ovenIds: number[], now: Date): Promise<Map<number, OvenRunSummary>> {
  const out = new Map<number, OvenRunSummary>(ovenIds.map((id) => [id, { lastRun: null, deltaT: [] }]));
  if (!ovenIds.length) return out;
  const cutoff = now.getTime() + 60_000;
  // Spelled out: drizzle writes a lone table's columns unqualified, and a bare "id" in the
  // subquery would be the run's own.
  const latest = await db
    .select({ runId: sql<number | null>`(select "r"."id" from "run" "r" where "r"."oven_id" = "oven"."id" and "r"."deleted_at" is null and "r"."run_at" < ${cutoff} order by "r"."run_at" desc, "r"."id" desc limit 1)` })
    .from(ovens)
    .where(inArray(ovens.id, ovenIds));
  const lastIds = latest.map((l) => l.runId).filter((id): id is number => id !== null);
  if (lastIds.length) {
    const rows = await db.select({ id: runs.id, ovenId: runs.ovenId, runAt: runs.runAt, verdict: runs.verdictStatus, windowUse: runs.windowUse, window: runs.windowValues }).from(runs).where(inArray(runs.id, lastIds));
    for (const r of rows) out.get(r.ovenId)!.lastRun = { id: r.id, runAt: r.runAt.toISOString(), verdict: r.verdict, windowUse: r.windowUse, deltaTMax: r.window.deltaTMax ?? null };
  }
  const spark = await db
    .select({ ovenId: runs.ovenId, at: runs.runAt, value: runs.deltaTPeak })
    .from(runs)
    .where(and(inArray(runs.ovenId, ovenIds), isNull(runs.deletedAt), gte(runs.runAt, new Date(now.getTime() - 30 * DAY))))
    .orderBy(asc(runs.ovenId), asc(runs.runAt), asc(runs.id));
  for (const s of spark) out.get(s.ovenId)!.deltaT.push({ at: s.at.toISOString(), value: s.value });
  return out;
}
