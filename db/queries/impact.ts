import "server-only";
import { and, asc, desc, eq, gte, isNull, lt, isNotNull } from "drizzle-orm";
import type { DbOrTx } from "../client";
import { runs } from "../schema/runs";
import { changes } from "../schema/changes";
import { calibrations, instruments } from "../schema/instruments";
import { welchTTest } from "@/lib/drift/welch-t-test";
import { measurementUncertainty, differenceResolvable, type UncertaintyComponent } from "@/lib/drift/measurement-uncertainty";
import { runsNeeded } from "@/lib/drift/runs-needed";
import { METRIC_INFO, type TrackedMetric } from "@/lib/tracked-metrics";
import { notFound } from "@/lib/errors";

export type ImpactResponse = {
  change: { id: number; ovenId: number; at: string; area: string; summary: string; before: string | null; after: string };
  metric: TrackedMetric;
  label: string;
  unit: string;
  before: { n: number; mean: number | null; sd: number | null; values: { runId: number; at: string; value: number }[] };
  after: { n: number; mean: number | null; sd: number | null; values: { runId: number; at: string; value: number }[] };
  difference: number | null;
  interval: [number, number] | null;
  t: number | null;
  df: number | null;
  p: number | null;
  expandedUncertainty: number | null;
  uncertaintyComponents: { label: string; u: number }[];
  resolvable: boolean | null;
  significant: boolean | null;
  runsNeeded: { delta: number; nPerGroup: number } | null;
  summary: string;
};

/**
 * The measurement system's expanded uncertainty for a metric, from the logger that made the
 * runs (GUM: accuracy and resolution as rectangular, the calibration certificate's U/k; k = 2).
 * Time metrics are limited by the sampling interval; rates are not assessed.
 */
export async function systemUncertainty(db: DbOrTx, metric: TrackedMetric, instrumentId: number | null, sampleInterval: number) {
  const unit = METRIC_INFO[metric].unit;
  if (unit === "s") return measurementUncertainty([{ label: "sampling interval", kind: "resolution", step: sampleInterval }]);
  if (unit !== "°C" || instrumentId == null) return null;
  const [inst] = await db.select().from(instruments).where(eq(instruments.id, instrumentId));
  const [cal] = await db.select().from(calibrations).where(eq(calibrations.instrumentId, instrumentId)).orderBy(desc(calibrations.performedAt)).limit(1);
  const parts: UncertaintyComponent[] = [];
  if (inst?.accuracy) parts.push({ label: "logger accuracy", kind: "rectangular", halfWidth: inst.accuracy });
  if (inst?.resolution) parts.push({ label: "logger resolution", kind: "resolution", step: inst.resolution });
  if (cal?.expandedUncertainty) parts.push({ label: "calibration certificate", kind: "expanded", expanded: cal.expandedUncertainty, k: 2 });
  return parts.length ? measurementUncertainty(parts) : null;
}

const fmt = (v: number, d: number) => (Math.abs(v) < 10 ** -d ? 0 : v).toFixed(d);

export async function changeImpact(db: DbOrTx, changeId: number, metric: TrackedMetric, opts: { before: number; after: number; delta?: number }): Promise<ImpactResponse> {
  const [c] = await db.select().from(changes).where(eq(changes.id, changeId));
  if (!c) throw notFound("That change");
  const col = runs[metric];
  const base = and(eq(runs.ovenId, c.ovenId), isNull(runs.deletedAt), isNotNull(col));
  const pick = { runId: runs.id, at: runs.runAt, value: col, instrumentId: runs.instrumentId, sampleInterval: runs.sampleInterval };
  const beforeRows = (await db.select(pick).from(runs).where(and(base, lt(runs.runAt, c.at))).orderBy(desc(runs.runAt)).limit(opts.before)).reverse();
  const afterRows = await db.select(pick).from(runs).where(and(base, gte(runs.runAt, c.at))).orderBy(asc(runs.runAt)).limit(opts.after);
  const vb = beforeRows.map((r) => r.value as number);
  const va = afterRows.map((r) => r.value as number);
  const info = METRIC_INFO[metric];
  const w = vb.length >= 2 && va.length >= 2 ? welchTTest(vb, va) : null;
  const ref = afterRows[0] ?? beforeRows[beforeRows.length - 1];
  const budget = ref ? await systemUncertainty(db, metric, ref.instrumentId, ref.sampleInterval) : null;
  const delta = opts.delta ?? (info.unit === "°C" ? 0.5 : info.unit === "s" ? 2 : 0.05);
  const planner = w && w.before.sd > 0 ? runsNeeded({ delta, sigma: w.before.sd }) : null;
  const significant = w ? w.pTwoSided < 0.05 : null;
  const resolvable = w && budget ? differenceResolvable({ difference: w.difference, expandedUncertainty: budget.expanded }) : null;
  const unit = info.unit;
  let summary: string;
  if (!w) summary = `Not enough runs to compare: ${vb.length} before and ${va.length} after (at least two each).`;
  else {
    const dir = w.difference < 0 ? "lower" : "higher";
    const size = `${fmt(Math.abs(w.difference), info.decimals + 1)} ${unit}`;
    const floor = budget ? `±${fmt(budget.expanded, info.decimals + 1)} ${unit}` : null;
    const vsFloor = floor ? (resolvable ? ` — more than the measurement can be wrong by (${floor})` : ` — within what the measurement can be wrong by (${floor}), so not proved`) : "";
    const sig = significant ? "" : " The difference could be chance (p ≥ 0.05).";
    summary = `${info.label} is ${size} ${dir} since the change${vsFloor}. ${vb.length} runs before, ${va.length} after.${sig}`;
  }
  const rows = (list: typeof beforeRows) => list.map((r) => ({ runId: r.runId, at: r.at.toISOString(), value: r.value as number }));
  return {
    change: { id: c.id, ovenId: c.ovenId, at: c.at.toISOString(), area: c.area, summary: c.summary, before: c.before, after: c.after },
    metric,
    label: info.label,
    unit,
    before: { n: vb.length, mean: w?.before.mean ?? null, sd: w?.before.sd ?? null, values: rows(beforeRows) },
    after: { n: va.length, mean: w?.after.mean ?? null, sd: w?.after.sd ?? null, values: rows(afterRows) },
    difference: w?.difference ?? null,
    interval: w?.ci ?? null,
    t: w?.t ?? null,
    df: w?.df ?? null,
    p: w?.pTwoSided ?? null,
    expandedUncertainty: budget?.expanded ?? null,
    uncertaintyComponents: budget?.components.map((x) => ({ label: x.label, u: x.u })) ?? [],
    resolvable,
    significant,
    runsNeeded: planner ? { delta, nPerGroup: planner.nPerGroup } : null,
    summary,
  };
}
