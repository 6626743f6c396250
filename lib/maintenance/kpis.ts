import { isOpenState, type WorkOrderKind, type WorkOrderState } from "./work-order-state";

/*
 * Maintenance KPIs over a period [from, to). Definitions in words: kpi-definitions.ts.
 * Every KPI is either a number or null with the reason it is undefined.
 */

const MINUTE_MS = 60_000;
const DAY_MS = 86_400_000;

export type KpiOrder = {
  id: string;
  ovenId: string;
  kind: WorkOrderKind;
  state: WorkOrderState;
  createdAt: Date;
  dueAt: Date | null;
  completedAt: Date | null;
  /** Corrective orders only: the equipment failed and stopped production. */
  breakdown?: boolean;
  failureStartedAt?: Date | null;
  downtimeMinutes?: number | null;
};

export type Kpi = { value: number; reason?: undefined } | { value: null; reason: string };

export type Period = { from: Date; to: Date; now: Date };

export type PmComplianceResult = Kpi & { doneOnTime: number; due: number; cancelledExcluded: number };

export function pmCompliance(orders: readonly KpiOrder[], p: Period, graceMinutes = 0): PmComplianceResult {
  const countUntil = Math.min(p.to.getTime(), p.now.getTime());
  const inPeriod = orders.filter(
    (o) => o.kind === "preventive" && o.dueAt !== null &&
      o.dueAt.getTime() >= p.from.getTime() && o.dueAt.getTime() < countUntil,
  );
  const due = inPeriod.filter((o) => o.state !== "cancelled");
  const doneOnTime = due.filter(
    (o) => o.state === "done" && o.completedAt !== null &&
      o.completedAt.getTime() <= o.dueAt!.getTime() + graceMinutes * MINUTE_MS,
  ).length;
  const counts = { doneOnTime, due: due.length, cancelledExcluded: inPeriod.length - due.length };
  if (due.length === 0) {
    return { value: null, reason: "No preventive work orders were due in the period.", ...counts };
  }
  return { value: doneOnTime / due.length, ...counts };
}

export type BreakdownStats = {
  /** Breakdowns whose failure started in [from, to). */
  breakdowns: number;
  /** Of those, repaired (done). */
  repaired: number;
  /** Full recorded downtime of the repaired ones (for MTTR). */
  repairMinutes: number;
  /** Downtime of any breakdown that lies inside [from, to) (for MTBF and availability). */
  downtimeMinutesInPeriod: number;
};

function isBreakdown(o: KpiOrder): o is KpiOrder & { failureStartedAt: Date } {
  return o.kind === "corrective" && o.breakdown === true && o.failureStartedAt instanceof Date && o.state !== "cancelled";
}

/** Minutes of downtime for one breakdown: recorded, else close − failure, else ongoing to now. */
function downtimeMinutes(o: KpiOrder & { failureStartedAt: Date }, now: Date): number {
  if (typeof o.downtimeMinutes === "number" && o.downtimeMinutes >= 0) return o.downtimeMinutes;
  const end = o.state === "done" && o.completedAt ? o.completedAt : now;
  return Math.max(0, (end.getTime() - o.failureStartedAt.getTime()) / MINUTE_MS);
}

export function breakdownStats(orders: readonly KpiOrder[], p: Period): BreakdownStats {
  const stats: BreakdownStats = { breakdowns: 0, repaired: 0, repairMinutes: 0, downtimeMinutesInPeriod: 0 };
  const from = p.from.getTime();
  const to = p.to.getTime();
  for (const o of orders.filter(isBreakdown)) {
    const start = o.failureStartedAt.getTime();
    const minutes = downtimeMinutes(o, p.now);
    const overlap = Math.min(to, start + minutes * MINUTE_MS) - Math.max(from, start);
    if (overlap > 0) stats.downtimeMinutesInPeriod += overlap / MINUTE_MS;
    if (start < from || start >= to) continue;
    stats.breakdowns += 1;
    if (o.state === "done") {
      stats.repaired += 1;
      stats.repairMinutes += minutes;
    }
  }
  return stats;
}

export const BACKLOG_BUCKETS = ["0-7", "8-30", "31-90", "over-90"] as const;
export type BacklogBucket = (typeof BACKLOG_BUCKETS)[number];
export type Backlog = Record<BacklogBucket, number> & { total: number };

/** Age in whole days (floored) since due (or raised, if unscheduled); not-yet-due orders excluded. */
export function backlogByAge(orders: readonly KpiOrder[], now: Date): Backlog {
  const backlog: Backlog = { "0-7": 0, "8-30": 0, "31-90": 0, "over-90": 0, total: 0 };
  for (const o of orders) {
    if (!isOpenState(o.state)) continue;
    const since = (o.dueAt ?? o.createdAt).getTime();
    if (since > now.getTime()) continue;
    const days = Math.floor((now.getTime() - since) / DAY_MS);
    const bucket: BacklogBucket = days <= 7 ? "0-7" : days <= 30 ? "8-30" : days <= 90 ? "31-90" : "over-90";
    backlog[bucket] += 1;
    backlog.total += 1;
  }
  return backlog;
}

export type KpiSet = {
  pmCompliance: PmComplianceResult;
  mtbfHours: Kpi;
  mttrMinutes: Kpi;
  availability: Kpi;
  backlog: Backlog;
  breakdowns: BreakdownStats;
  periodMinutes: number;
  operatingMinutes: number;
};

function periodMinutes(p: Period): number {
  const minutes = (p.to.getTime() - p.from.getTime()) / MINUTE_MS;
  if (!(minutes > 0)) throw new Error("The period must end after it starts.");
  return minutes;
}

function assemble(
  pm: PmComplianceResult,
  stats: BreakdownStats,
  backlog: Backlog,
  minutes: number,
  operating: number,
): KpiSet {
  const uptime = Math.max(0, operating - stats.downtimeMinutesInPeriod);
  const mtbfHours: Kpi = stats.breakdowns === 0
    ? { value: null, reason: `No breakdowns started in the period (${(uptime / 60).toFixed(1)} h of operation without one).` }
    : { value: uptime / 60 / stats.breakdowns };
  const mttrMinutes: Kpi = stats.repaired === 0
    ? { value: null, reason: stats.breakdowns === 0 ? "No breakdowns started in the period." : "No breakdown that started in the period has been repaired yet." }
    : { value: stats.repairMinutes / stats.repaired };
  const availability: Kpi = { value: Math.max(0, minutes - stats.downtimeMinutesInPeriod) / minutes };
  return { pmCompliance: pm, mtbfHours, mttrMinutes, availability, backlog, breakdowns: stats, periodMinutes: minutes, operatingMinutes: operating };
}

/**
 * KPIs for one oven. `operatingMinutes` is the planned production time in the period (default:
 * the whole period, for ovens that run around the clock).
 */
export function ovenKpis(input: Period & {
  ovenId: string;
  orders: readonly KpiOrder[];
  operatingMinutes?: number;
  graceMinutes?: number;
}): KpiSet {
  const minutes = periodMinutes(input);
  const orders = input.orders.filter((o) => o.ovenId === input.ovenId);
  return assemble(
    pmCompliance(orders, input, input.graceMinutes),
    breakdownStats(orders, input),
    backlogByAge(orders, input.now),
    minutes,
    input.operatingMinutes ?? minutes,
  );
}

/** Per-oven KPIs and the fleet's, computed from summed counts (never averaged ratios). */
export function fleetKpis(input: Period & {
  ovens: readonly { ovenId: string; operatingMinutes?: number }[];
  orders: readonly KpiOrder[];
  graceMinutes?: number;
}): { perOven: (KpiSet & { ovenId: string })[]; fleet: KpiSet } {
  const perOven = input.ovens.map((oven) => ({
    ovenId: oven.ovenId,
    ...ovenKpis({ ...input, ovenId: oven.ovenId, operatingMinutes: oven.operatingMinutes }),
  }));
  const sum = (f: (k: KpiSet) => number) => perOven.reduce((acc, k) => acc + f(k), 0);
  const due = sum((k) => k.pmCompliance.due);
  const doneOnTime = sum((k) => k.pmCompliance.doneOnTime);
  const counts = { doneOnTime, due, cancelledExcluded: sum((k) => k.pmCompliance.cancelledExcluded) };
  const pm: PmComplianceResult = due === 0
    ? { value: null, reason: "No preventive work orders were due in the period.", ...counts }
    : { value: doneOnTime / due, ...counts };
  const stats: BreakdownStats = {
    breakdowns: sum((k) => k.breakdowns.breakdowns),
    repaired: sum((k) => k.breakdowns.repaired),
    repairMinutes: sum((k) => k.breakdowns.repairMinutes),
    downtimeMinutesInPeriod: sum((k) => k.breakdowns.downtimeMinutesInPeriod),
  };
  const backlog = { total: 0 } as Backlog;
  for (const b of [...BACKLOG_BUCKETS, "total"] as const) backlog[b] = sum((k) => k.backlog[b]);
  const fleet = assemble(pm, stats, backlog, sum((k) => k.periodMinutes), sum((k) => k.operatingMinutes));
  if (perOven.length === 0) fleet.availability = { value: null, reason: "No ovens were selected." };
  return { perOven, fleet };
}
