/**
 * Single-curve primitives on samples (t strictly increasing, s; v in °C). Linear interpolation
 * between samples everywhere; all O(n).
 */

/** Largest sample and the time of its first occurrence. */
export function peakOf(t: ArrayLike<number>, v: ArrayLike<number>): { peak: number; timeAtPeak: number } {
  let best = 0;
  for (let i = 1; i < v.length; i++) if (v[i] > v[best]) best = i;
  return { peak: v[best], timeAtPeak: t[best] };
}

/**
 * Time of the first upward crossing of `x`: the first pair of samples with v[j−1] < x ≤ v[j],
 * interpolated linearly. A curve that starts at or above x has not crossed it (null), unless it
 * first drops below and comes back.
 */
export function firstUpCrossing(t: ArrayLike<number>, v: ArrayLike<number>, x: number): number | null {
  for (let j = 1; j < v.length; j++) {
    const a = v[j - 1];
    const b = v[j];
    if (a < x && b >= x) return t[j - 1] + ((x - a) / (b - a)) * (t[j] - t[j - 1]);
  }
  return null;
}

/** Total time with v above x, segments cut at the interpolated crossings. */
export function timeAbove(t: ArrayLike<number>, v: ArrayLike<number>, x: number): number {
  let total = 0;
  for (let j = 1; j < v.length; j++) {
    const a = v[j - 1];
    const b = v[j];
    const dt = t[j] - t[j - 1];
    if (a >= x && b >= x) total += dt;
    else if (a < x && b > x) total += (dt * (b - x)) / (b - a);
    else if (a > x && b < x) total += (dt * (a - x)) / (a - b);
  }
  return total;
}

export interface CurveScan {
  peak: number;
  timeAtPeak: number;
  /** First upward crossing of each threshold (as firstUpCrossing), in the order given. */
  crossings: Array<number | null>;
  /** Time above `level` (as timeAbove). */
  timeAbove: number;
}

/** peakOf, firstUpCrossing for several thresholds and timeAbove in one pass over the samples. */
export function scanCurve(t: ArrayLike<number>, v: ArrayLike<number>, thresholds: readonly number[], level: number): CurveScan {
  const n = v.length;
  const k = thresholds.length;
  const crossings: Array<number | null> = new Array(k).fill(null);
  let open = k;
  let best = 0;
  let above = 0;
  let a = v[0];
  for (let j = 1; j < n; j++) {
    const b = v[j];
    if (b > v[best]) best = j;
    const dt = t[j] - t[j - 1];
    if (a >= level && b >= level) above += dt;
    else if (a < level && b > level) above += (dt * (b - level)) / (b - a);
    else if (a > level && b < level) above += (dt * (a - level)) / (a - b);
    if (open > 0 && b > a) {
      for (let i = 0; i < k; i++) {
        const x = thresholds[i];
        if (crossings[i] === null && a < x && b >= x) {
          crossings[i] = t[j - 1] + ((x - a) / (b - a)) * dt;
          open--;
        }
      }
    }
    a = b;
  }
  return { peak: v[best], timeAtPeak: t[best], crossings, timeAbove: above };
}

/**
 * Largest rising and falling least-squares slopes over closed windows [t_j, t_j + w], for every j
 * whose window ends within the data. Two pointers and running sums make it O(n). Sums are kept
 * relative to a reference sample and rebuilt from scratch once the window has moved by its own
 * length, so rounding cannot build up over long files (amortised cost stays O(n)).
 * Returns null when no window holds two samples. Both answers are ≥ 0 (°C/s).
 */
export function slopeExtremes(t: ArrayLike<number>, v: ArrayLike<number>, w: number): { up: number; down: number } | null {
  const n = t.length;
  if (n < 2) return null;
  const eps = 1e-9 * Math.max(1, Math.abs(t[n - 1]), w);
  const tLast = t[n - 1];
  let tr = t[0];
  let vr = v[0];
  let sx = 0, sy = 0, sxx = 0, sxy = 0;
  let hi = 0;
  let sinceRebuild = 0;
  let maxSlope = -Infinity;
  let minSlope = Infinity;
  for (let j = 0; j < n; j++) {
    const end = t[j] + w;
    if (end > tLast + eps) break;
    while (hi < n && t[hi] <= end + eps) {
      const x = t[hi] - tr;
      const y = v[hi] - vr;
      sx += x; sy += y; sxx += x * x; sxy += x * y;
      hi++;
    }
    const count = hi - j;
    if (count >= 2) {
      const den = count * sxx - sx * sx;
      if (den > 0) {
        const slope = (count * sxy - sx * sy) / den;
        if (slope > maxSlope) maxSlope = slope;
        if (slope < minSlope) minSlope = slope;
      }
    }
    // Slide: drop sample j.
    const x = t[j] - tr;
    const y = v[j] - vr;
    sx -= x; sy -= y; sxx -= x * x; sxy -= x * y;
    if (j + 1 >= hi) {
      // Window emptied (w shorter than the sample step): restart the sums at the next sample.
      if (j + 1 < n) { tr = t[j + 1]; vr = v[j + 1]; }
      sx = sy = sxx = sxy = 0;
      sinceRebuild = 0;
    } else if (++sinceRebuild >= Math.max(32, count)) {
      tr = t[j + 1];
      vr = v[j + 1];
      sx = sy = sxx = sxy = 0;
      for (let k = j + 1; k < hi; k++) {
        const xk = t[k] - tr;
        const yk = v[k] - vr;
        sx += xk; sy += yk; sxx += xk * xk; sxy += xk * yk;
      }
      sinceRebuild = 0;
    }
  }
  if (maxSlope === -Infinity) return null;
  return { up: Math.max(0, maxSlope), down: Math.max(0, -minSlope) };
}
