// Largest-Triangle-Three-Buckets downsampling (Steinarsson 2013) for trend charts: keeps the
// first and last points and, from each of threshold − 2 equal buckets in between, the point
// forming the largest triangle with the previously kept point and the next bucket's average.

export const CHART_POINT_LIMIT = 1000;

export function lttb<T>(data: readonly T[], threshold: number, x: (d: T) => number, y: (d: T) => number): T[] {
  if (!Number.isInteger(threshold) || threshold < 3) throw new RangeError("lttb: threshold must be an integer ≥ 3");
  const n = data.length;
  if (n <= threshold) return [...data];

  const out: T[] = [data[0]];
  const buckets = threshold - 2;
  // Bucket edges from integer arithmetic, so the last edge is exactly n − 1.
  const edge = (i: number) => Math.floor((i * (n - 2)) / buckets) + 1;
  let a = 0;
  for (let i = 0; i < buckets; i++) {
    const nextStart = edge(i + 1);
    const nextEnd = i + 2 > buckets ? n : edge(i + 2);
    let avgX = 0;
    let avgY = 0;
    for (let j = nextStart; j < nextEnd; j++) {
      avgX += x(data[j]);
      avgY += y(data[j]);
    }
    const len = nextEnd - nextStart;
    avgX /= len;
    avgY /= len;

    const start = edge(i);
    const end = edge(i + 1);
    const ax = x(data[a]);
    const ay = y(data[a]);
    let maxArea = -1;
    let pick = start;
    for (let j = start; j < end; j++) {
      const area = Math.abs((ax - avgX) * (y(data[j]) - ay) - (ax - x(data[j])) * (avgY - ay));
      if (area > maxArea) {
        maxArea = area;
        pick = j;
      }
    }
    out.push(data[pick]);
    a = pick;
  }
  out.push(data[n - 1]);
  return out;
}

/** Chart helper: LTTB down to `limit` (1 000) points only when there are more. */
export function downsampleForChart<T extends { at: number; value: number }>(points: readonly T[], limit = CHART_POINT_LIMIT): T[] {
  return lttb(points, limit, (p) => p.at, (p) => p.value);
}
