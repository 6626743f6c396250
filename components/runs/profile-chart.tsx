"use client";
import { useMemo, useState } from "react";
import { Brush, CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { probeColour, probeDash } from "@/components/charts/probe-colours";
import type { Phases, ProfileSeries } from "@/lib/runs/chart-data";

type Bands = { liquidus: number; peakMin: number; peakMax: number; soakStart: number; soakEnd: number };

function TooltipBody({ active, label, payload }: { active?: boolean; label?: number; payload?: { dataKey?: unknown; value?: unknown; color?: string; name?: unknown }[] }) {
  if (!active || !payload?.length) return null;
  return (
    <div className="rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-xs shadow-sm">
      <p className="mb-1 font-semibold">
        <span className="num">{Number(label).toFixed(0)}</span> <span className="unit">s</span>
      </p>
      <ul className="grid grid-cols-2 gap-x-4 gap-y-0.5">
        {payload.map((p) => (
          <li key={String(p.dataKey)} className="flex items-center gap-1.5">
            <span aria-hidden="true" className="inline-block h-2 w-3 rounded-sm" style={{ background: p.color }} />
            {String(p.name)} <span className="num ml-auto">{Number(p.value).toFixed(1)}</span> <span className="unit">°C</span>
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * The profile chart: every probe in its fixed colour, the window's peak and soak bands, the
 * liquidus line, the soak and above-liquidus phases shaded; probes toggled from the legend, a
 * time range chosen with the brush, and the same data as a table for screen readers.
 */
export function ProfileChart({ series, bands, phases, height = 360, compact = false }: { series: ProfileSeries; bands: Bands; phases: Phases | null; height?: number; compact?: boolean }) {
  const [hidden, setHidden] = useState<Set<string>>(new Set());
  const data = useMemo(() => series.time.map((t, k) => Object.fromEntries([["t", t], ...series.probes.map((p) => [p.key, p.values[k]])])), [series]);
  const toggle = (key: string) =>
    setHidden((h) => {
      const next = new Set(h);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });
  const tableRows = useMemo(() => {
    const step = Math.max(1, Math.round(series.time.length / 60));
    return series.time.map((t, k) => ({ t, k })).filter((_, k) => k % step === 0);
  }, [series]);
  return (
    <figure className="space-y-2">
      <div style={{ height }} role="group" aria-label="Profile chart: probe temperatures over time (the table below holds the same data)">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 12, bottom: compact ? 0 : 8, left: 0 }}>
            <CartesianGrid stroke="#e2dbd0" strokeDasharray="3 3" />
            {phases?.soak ? <ReferenceArea x1={phases.soak[0]} x2={phases.soak[1]} fill="#88CCEE" fillOpacity={0.12} label={compact ? undefined : { value: "soak", position: "insideTopLeft", fontSize: 11, fill: "#5b636b" }} /> : null}
            {phases?.aboveLiquidus ? <ReferenceArea x1={phases.aboveLiquidus[0]} x2={phases.aboveLiquidus[1]} fill="#CC6677" fillOpacity={0.1} label={compact ? undefined : { value: "above liquidus", position: "insideTopLeft", fontSize: 11, fill: "#5b636b" }} /> : null}
            <ReferenceArea y1={bands.peakMin} y2={bands.peakMax} fill="#c2410c" fillOpacity={0.08} stroke="#c2410c" strokeOpacity={0.3} strokeDasharray="4 3" />
            <ReferenceArea y1={bands.soakStart} y2={bands.soakEnd} fill="#44AA99" fillOpacity={0.05} />
            <ReferenceLine y={bands.liquidus} stroke="#9f1239" strokeDasharray="6 4" label={compact ? undefined : { value: `liquidus ${bands.liquidus} °C`, position: "insideBottomRight", fontSize: 11, fill: "#9f1239" }} />
            <XAxis dataKey="t" type="number" domain={["dataMin", "dataMax"]} tick={{ fontSize: 11 }} label={compact ? undefined : { value: "time (s)", position: "insideBottom", offset: -4, fontSize: 11 }} />
            <YAxis domain={[0, (max: number) => Math.max(260, Math.ceil(max / 10) * 10)]} tick={{ fontSize: 11 }} width={44} label={compact ? undefined : { value: "°C", angle: -90, position: "insideLeft", fontSize: 11 }} />
            <Tooltip content={<TooltipBody />} isAnimationActive={false} />
            {series.probes.map((p, i) => (
              <Line key={p.key} dataKey={p.key} name={p.label} stroke={probeColour(i)} strokeDasharray={probeDash(i)} dot={false} strokeWidth={1.6} isAnimationActive={false} hide={hidden.has(p.key)} />
            ))}
            {compact ? null : <Brush dataKey="t" height={22} stroke="#8a9096" travellerWidth={10} />}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption>
        <ul className="flex flex-wrap gap-1.5 text-xs" aria-label="Probes (press to show or hide)">
          {series.probes.map((p, i) => (
            <li key={p.key}>
              <button
                type="button"
                onClick={() => toggle(p.key)}
                aria-pressed={!hidden.has(p.key)}
                className={`inline-flex min-h-9 items-center gap-1.5 rounded-full border border-paper-line px-2.5 ${hidden.has(p.key) ? "opacity-40 line-through" : ""}`}
              >
                <span aria-hidden="true" className="inline-block h-2.5 w-4 rounded-sm" style={{ background: probeColour(i) }} />
                {p.label}
              </button>
            </li>
          ))}
        </ul>
        {compact ? null : <p className="mt-1 text-xs text-ink-muted">Drag the handles under the chart to zoom on a time range. Shaded: peak band {bands.peakMin}–{bands.peakMax} °C, soak and time above liquidus.</p>}
      </figcaption>
      <details className="text-sm">
        <summary className="min-h-11 cursor-pointer py-2 text-ink-soft">Show the profile as a table</summary>
        <div className="max-h-80 overflow-auto" tabIndex={0} role="region" aria-label="Profile table">
          <table className="w-full text-right text-xs">
            <caption className="sr-only">Probe temperatures in °C by time in seconds</caption>
            <thead>
              <tr>
                <th scope="col" className="px-2 py-1">t (s)</th>
                {series.probes.map((p) => (
                  <th key={p.key} scope="col" className="px-2 py-1">{p.label}</th>
                ))}
              </tr>
            </thead>
            <tbody className="num">
              {tableRows.map(({ t, k }) => (
                <tr key={k} className="border-t border-paper-line">
                  <th scope="row" className="px-2 py-0.5 font-normal">{t.toFixed(0)}</th>
                  {series.probes.map((p) => (
                    <td key={p.key} className="px-2 py-0.5">{p.values[k].toFixed(1)}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
