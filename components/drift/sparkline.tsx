// A small ΔT line over the last 30 days with the window's limit as a faint line. Server-rendered SVG.
export function Sparkline({ points, limit, label, width = 120, height = 32 }: { points: { at: string; value: number }[]; limit: number | null; label: string; width?: number; height?: number }) {
  if (points.length < 2) return <span className="text-xs text-ink-muted">no runs in 30 days</span>;
  const xs = points.map((p) => Date.parse(p.at));
  const ys = points.map((p) => p.value);
  const lo = Math.min(...ys, limit ?? Infinity) * 0.95;
  const hi = Math.max(...ys, limit ?? -Infinity) * 1.05;
  const x0 = xs[0];
  const dx = Math.max(1, xs[xs.length - 1] - x0);
  const sx = (x: number) => ((x - x0) / dx) * (width - 2) + 1;
  const sy = (y: number) => height - 1 - ((y - lo) / Math.max(1e-9, hi - lo)) * (height - 2);
  const d = points.map((p, i) => `${i ? "L" : "M"}${sx(xs[i]).toFixed(1)},${sy(p.value).toFixed(1)}`).join(" ");
  const last = ys[ys.length - 1];
  return (
    <svg width={width} height={height} role="img" aria-label={`${label}: last ${last.toFixed(1)} °C${limit != null ? `, limit ${limit} °C` : ""}, ${points.length} runs in 30 days`}>
      {limit != null ? <line x1={0} x2={width} y1={sy(limit)} y2={sy(limit)} stroke="#9f1239" strokeOpacity={0.35} strokeDasharray="3 2" /> : null}
      <path d={d} fill="none" stroke="#3d454d" strokeWidth={1.4} />
      <circle cx={sx(xs[xs.length - 1])} cy={sy(last)} r={2.2} fill="#c2410c" />
    </svg>
  );
}
