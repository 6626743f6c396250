import { firstUpCrossing } from "@/lib/thermal/curve";
import type { ProcessWindow } from "@/lib/thermal/windows";

export interface ProfileSeries {
  time: number[];
  probes: { key: string; label: string; values: number[] }[];
}

export interface Phases {
  /** Earliest first reach of soakStart → latest first reach of soakEnd, s. */
  soak: [number, number] | null;
  /** Earliest first reach of liquidus → last sample above liquidus on any probe, s. */
  aboveLiquidus: [number, number] | null;
}

/** The shaded phases of a profile chart, from the curves and the window's thresholds. */
export function phasesOf(time: ArrayLike<number>, channels: ArrayLike<number>[], w: ProcessWindow): Phases {
  const earliest = (x: number) => {
    const ts = channels.map((c) => firstUpCrossing(time, c, x)).filter((v): v is number => v !== null);
    return ts.length ? Math.min(...ts) : null;
  };
  const latest = (x: number) => {
    const ts = channels.map((c) => firstUpCrossing(time, c, x));
    return ts.every((v) => v !== null) ? Math.max(...(ts as number[])) : null;
  };
  const soakA = earliest(w.soakStart);
  const soakB = latest(w.soakEnd);
  const liqA = earliest(w.liquidus);
  let liqB: number | null = null;
  for (const c of channels) {
    for (let k = c.length - 1; k >= 0; k--) {
      if (c[k] >= w.liquidus) {
        liqB = Math.max(liqB ?? -Infinity, time[k]);
        break;
      }
    }
  }
  return {
    soak: soakA !== null && soakB !== null && soakB > soakA ? [soakA, soakB] : null,
    aboveLiquidus: liqA !== null && liqB !== null && liqB > liqA ? [liqA, liqB] : null,
  };
}

/** Keeps at most `max` rows (every k-th, plus the last), so long files stay light to draw. */
export function thinSeries(time: ArrayLike<number>, channels: ArrayLike<number>[], max = 1500): { time: number[]; channels: number[][] } {
  const n = time.length;
  const step = Math.max(1, Math.ceil(n / max));
  const idx: number[] = [];
  for (let k = 0; k < n; k += step) idx.push(k);
  if (n > 0 && idx[idx.length - 1] !== n - 1) idx.push(n - 1);
  const r = (x: number) => Math.round(x * 100) / 100;
  return { time: idx.map((k) => r(time[k])), channels: channels.map((c) => idx.map((k) => r(c[k]))) };
}
