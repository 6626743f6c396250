"use client";
import { useState } from "react";
import { probeColour } from "@/components/charts/probe-colours";

export type BoardMapProbe = { label: string; x: number; y: number; sitsOn: string; peak: number | null; index: number };

// ColorBrewer sequential YlOrBr for peaks and diverging RdBu for deviations (both colour-blind safe).
const SEQUENTIAL = ["#ffffd4", "#fee391", "#fec44f", "#fe9929", "#d95f0e", "#993404"];
const DIVERGING = ["#2166ac", "#67a9cf", "#d1e5f0", "#f7f7f7", "#fddbc7", "#ef8a62", "#b2182b"];

function hex(c: string) {
  return [1, 3, 5].map((i) => parseInt(c.slice(i, i + 2), 16));
}
function interpolate(stops: string[], f: number): string {
  const x = Math.max(0, Math.min(1, f)) * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(x));
  const a = hex(stops[i]);
  const b = hex(stops[i + 1]);
  const t = x - i;
  return `rgb(${a.map((v, k) => Math.round(v + (b[k] - v) * t)).join(",")})`;
}

/** Probe positions on the board outline, coloured by peak or by deviation from the board mean. */
export function BoardMap({ name, widthMm, heightMm, probes }: { name: string; widthMm: number; heightMm: number; probes: BoardMapProbe[] }) {
  const [mode, setMode] = useState<"peak" | "deviation">("peak");
  const peaks = probes.map((p) => p.peak).filter((v): v is number => v !== null);
  const mean = peaks.reduce((a, b) => a + b, 0) / Math.max(1, peaks.length);
  const lo = Math.min(...peaks);
  const hi = Math.max(...peaks);
  const span = Math.max(0.5, ...peaks.map((v) => Math.abs(v - mean)));
  const colourOf = (v: number | null) => (v === null ? "#e2dbd0" : mode === "peak" ? interpolate(SEQUENTIAL, hi > lo ? (v - lo) / (hi - lo) : 0.5) : interpolate(DIVERGING, 0.5 + (v - mean) / (2 * span)));
  const valueOf = (v: number | null) => (v === null ? "no value" : mode === "peak" ? `${v.toFixed(1)} °C` : `${v - mean >= 0 ? "+" : "−"}${Math.abs(v - mean).toFixed(1)} °C`);
  const r = Math.max(widthMm, heightMm) * 0.035;
  const pad = r * 2.4;
  return (
    <figure className="space-y-3">
      <div className="flex flex-wrap gap-1" role="group" aria-label="Colour the probes by">
        {(["peak", "deviation"] as const).map((m) => (
          <button key={m} type="button" aria-pressed={mode === m} onClick={() => setMode(m)} className={`min-h-11 rounded-lg border px-3 text-sm font-medium ${mode === m ? "border-ember bg-ember-soft text-ink" : "border-paper-line bg-paper-raised text-ink-soft"}`}>
            {m === "peak" ? "Peak" : "Deviation from board mean"}
          </button>
        ))}
      </div>
      <svg viewBox={`${-pad} ${-pad} ${widthMm + 2 * pad} ${heightMm + 2 * pad}`} className="w-full" role="img" aria-label={`Board map of ${name}: ${probes.length} probes coloured by ${mode === "peak" ? "peak temperature" : "deviation from the board mean"}`}>
        <rect x={0} y={0} width={widthMm} height={heightMm} rx={2} fill="#f3efe6" stroke="#3d454d" strokeWidth={0.8} />
        {probes.map((p) => (
          <g key={p.label}>
            <title>{`${p.label} (${p.sitsOn || "no description"}): ${valueOf(p.peak)}`}</title>
            <circle cx={p.x} cy={p.y} r={r} fill={colourOf(p.peak)} stroke={probeColour(p.index)} strokeWidth={r * 0.35} />
            <text x={p.x} y={p.y - r * 1.45} textAnchor="middle" fontSize={r * 0.95} fill="#1c2126" fontWeight={600}>{p.label}</text>
            <text x={p.x} y={p.y + r * 2.3} textAnchor="middle" fontSize={r * 0.85} fill="#3d454d">{valueOf(p.peak).replace(" °C", "")}</text>
          </g>
        ))}
      </svg>
      <figcaption className="space-y-2 text-xs text-ink-muted">
        <div className="flex items-center gap-2" aria-hidden="true">
          <span className="num">{mode === "peak" ? `${lo.toFixed(1)} °C` : `−${span.toFixed(1)} °C`}</span>
          <span className="h-3 flex-1 rounded" style={{ background: `linear-gradient(to right, ${(mode === "peak" ? SEQUENTIAL : DIVERGING).join(",")})` }} />
          <span className="num">{mode === "peak" ? `${hi.toFixed(1)} °C` : `+${span.toFixed(1)} °C`}</span>
        </div>
        <p>Ring colour = probe colour on the chart. Board mean peak <span className="num">{mean.toFixed(1)}</span> °C.</p>
        <ul className="sr-only">
          {probes.map((p) => (
            <li key={p.label}>{`${p.label}, ${p.sitsOn}, at ${p.x} by ${p.y} mm: ${valueOf(p.peak)}`}</li>
          ))}
        </ul>
      </figcaption>
    </figure>
  );
}
