import type { BoardMetrics, Verdict, VerdictItems, VerdictStatus } from "./types";
import type { ProcessWindow } from "./windows";

/** Window use of a two-sided statistic: |value − centre| ÷ half-width × 100, worst of the values. */
export function twoSidedUse(values: Array<number | null>, min: number, max: number): number | null {
  const centre = (min + max) / 2;
  const half = (max - min) / 2;
  let worst = -Infinity;
  for (const v of values) {
    if (v === null) return null;
    worst = Math.max(worst, (Math.abs(v - centre) / half) * 100);
  }
  return worst;
}

/** Window use of a one-sided limit: value ÷ limit × 100. */
export function oneSidedUse(value: number | null, limit: number): number | null {
  return value === null ? null : (value / limit) * 100;
}

export const PASS_LIMIT = 90;
export const FAIL_LIMIT = 100;

export function statusOf(windowUse: number | null, anyNull: boolean): VerdictStatus {
  if (anyNull || windowUse === null || windowUse > FAIL_LIMIT) return "fail";
  return windowUse > PASS_LIMIT ? "marginal" : "pass";
}

/**
 * Judges board statistics against a process window. Each item is the % of the window it uses;
 * windowUse is the largest item. pass ≤ 90 %, marginal ≤ 100 %, fail above 100 % or when a
 * statistic could not be computed because a probe never crossed its threshold: any null item,
 * or a null heat-up rate (judged by no item, but still a threshold the run never met).
 */
export function judge(board: BoardMetrics, window: ProcessWindow): Verdict {
  const items: VerdictItems = {
    peak: twoSidedUse([board.peakMin, board.peakMax], window.peakMin, window.peakMax),
    tal: twoSidedUse([board.talMin, board.talMax], window.talMin, window.talMax),
    soakTime: twoSidedUse([board.soakTimeMin, board.soakTimeMax], window.soakMin, window.soakMax),
    rampUp: oneSidedUse(board.rampUpMax, window.rampUpMax),
    rampDown: oneSidedUse(board.rampDownMax, window.rampDownMax),
    deltaT: oneSidedUse(board.deltaTPeak, window.deltaTMax),
    timeToPeak: oneSidedUse(board.timeToPeakMax, window.timeToPeakMax),
  };
  if (window.criticalSpreadMax !== undefined) {
    items.criticalSpread = oneSidedUse(board.criticalSpread, window.criticalSpreadMax);
  }
  const values = Object.values(items) as Array<number | null>;
  const present = values.filter((v): v is number => v !== null);
  const windowUse = present.length > 0 ? Math.max(...present) : null;
  const missing = present.length < values.length || board.heatUpRate === null;
  return { status: statusOf(windowUse, missing), windowUse, items };
}
