"use client";
import { useMemo } from "react";
import { CartesianGrid, ComposedChart, Line, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis, usePlotArea, useXAxisScale } from "recharts";
import type { TrendResponse } from "@/db/queries/trends";

const dayFmt = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short" });
const fullFmt = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });

type Row = { t: number; value: number; ewma: number | null; ucl: number | null; lcl: number | null; signal: number | null; projection?: number; runId: number; signals: string[] };

function TooltipBody({ active, payload, unit }: { active?: boolean; payload?: { payload?: Row }[]; unit: string }) {
  const row = payload?.[0]?.payload;
  if (!active || !row) return null;
  return (
    <div className="rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-xs shadow-sm">
      <p className="font-semibold">{fullFmt.format(new Date(row.t))}</p>
      {Number.isFinite(row.value) ? (
        <p>
          value <span className="num">{row.value.toFixed(2)}</span> <span className="unit">{unit}</span>
        </p>
      ) : null}
      {row.ewma != null ? (
        <p>
          EWMA <span className="num">{row.ewma.toFixed(2)}</span> (limits <span className="num">{row.lcl?.toFixed(2)}</span>–<span className="num">{row.ucl?.toFixed(2)}</span>)
        </p>
      ) : null}
      {row.projection != null ? <p>projected <span className="num">{row.projection.toFixed(2)}</span></p> : null}
      {row.signals.length ? <p className="font-semibold text-health-act">signals: {row.signals.join(", ")}</p> : null}
    </div>
  );
}

/**
 * Completed work orders as dotted vertical marks, all in one SVG path. A plant with daily tasks
 * has hundreds in six months; one ReferenceLine each made five stacked charts take seconds to draw.
 */
function WorkOrderMarks({ times }: { times: number[] }) {
  const x = useXAxisScale();
  const area = usePlotArea();
  if (!x || !area || !times.length) return null;
  const top = area.y;
  const bottom = area.y + area.height;
  let d = "";
  for (const t of times) {
    const px = x(t);
    if (px == null || !Number.isFinite(px) || px < area.x - 0.5 || px > area.x + area.width + 0.5) continue;
    d += `M${px.toFixed(1)} ${top}V${bottom}`;
  }
  // Dense marks (daily tasks on a phone-width chart) fade so the runs stay readable over them.
  const spacing = area.width / times.length;
  const opacity = spacing >= 6 ? 0.35 : Math.max(0.12, (0.35 * spacing) / 6);
  return d ? <path d={d} stroke="#0f766e" strokeOpacity={opacity} strokeDasharray="1 3" fill="none" data-testid="work-order-marks" data-count={times.length} /> : null;
}

/**
 * One metric across months: every run's value, the EWMA with its exact limits, the baseline
 * centre and ±3σ, the window limit, signals, changes and completed work orders on the time
 * axis, and the time-to-limit projection as a dashed line. A table alternative follows.
 */
export function TrendChart({ trend, height = 240, now }: { trend: TrendResponse; height?: number; now: number }) {
  const rows = useMemo<Row[]>(() => {
    const r: Row[] = trend.points.map((p) => ({
      t: Date.parse(p.runAt),
      value: p.value,
      ewma: p.ewma,
      ucl: p.ewmaUcl,
      lcl: p.ewmaLcl,
      signal: p.signals.length ? p.value : null,
      runId: p.runId,
      signals: p.signals,
    }));
    const proj = trend.projection;
    const last = r[r.length - 1];
    if (proj && last && proj.crossesAt && proj.daysToLimit != null && proj.daysToLimit > 0 && proj.daysToLimit < 120) {
      const end = Date.parse(proj.crossesAt);
      const startValue = proj.limit - proj.slopePerDay * ((end - now) / 86_400_000);
      r.push({ t: now, value: NaN, ewma: null, ucl: null, lcl: null, signal: null, projection: startValue, runId: -1, signals: [] });
      r.push({ t: end, value: NaN, ewma: null, ucl: null, lcl: null, signal: null, projection: proj.limit, runId: -2, signals: [] });
      if (last) last.projection = undefined;
    }
    return r;
  }, [trend, now]);
  const b = trend.baseline;
  const first = rows[0]?.t ?? now;
  const orderTimes = useMemo(() => trend.workOrders.map((w) => Date.parse(w.at)).filter((t) => t >= first), [trend, first]);
  return (
    <figure className="space-y-1">
      <div style={{ height }} aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={rows} margin={{ top: 18, right: 12, bottom: 4, left: 0 }}>
            <CartesianGrid stroke="#e2dbd0" strokeDasharray="3 3" />
            <XAxis dataKey="t" type="number" scale="time" domain={["dataMin", "dataMax"]} tickFormatter={(t) => dayFmt.format(new Date(t))} tick={{ fontSize: 11 }} />
            <YAxis tick={{ fontSize: 11 }} width={44} domain={["auto", "auto"]} label={{ value: trend.unit, angle: -90, position: "insideLeft", fontSize: 11 }} />
            {b ? <ReferenceLine y={b.mean} stroke="#3d454d" strokeOpacity={0.6} label={{ value: "baseline", position: "insideTopLeft", fontSize: 10, fill: "#5b636b" }} /> : null}
            {b && b.sigma > 0 ? <ReferenceLine y={b.ucl} stroke="#3d454d" strokeOpacity={0.35} strokeDasharray="2 3" /> : null}
            {b && b.sigma > 0 ? <ReferenceLine y={b.lcl} stroke="#3d454d" strokeOpacity={0.35} strokeDasharray="2 3" /> : null}
            {trend.windowLimit ? <ReferenceLine y={trend.windowLimit.value} stroke="#9f1239" strokeDasharray="6 4" label={{ value: `window limit ${trend.windowLimit.value} ${trend.unit}`, position: "insideBottomRight", fontSize: 10, fill: "#9f1239" }} /> : null}
            {trend.changes.filter((c) => Date.parse(c.at) >= first).map((c) => (
              <ReferenceLine key={`c${c.id}`} x={Date.parse(c.at)} stroke="#c2410c" strokeWidth={1.5} label={{ value: `▲ ${c.summary}`, position: "insideTopLeft", fontSize: 10, fill: "#9a3412" }} />
            ))}
            <WorkOrderMarks times={orderTimes} />
            <Line dataKey="value" stroke="#8a9096" strokeWidth={0} dot={{ r: 1.8, fill: "#5b636b", strokeWidth: 0 }} isAnimationActive={false} name="value" connectNulls={false} />
            <Line dataKey="ewma" stroke="#332288" strokeWidth={1.8} dot={false} isAnimationActive={false} name="EWMA" connectNulls={false} />
            <Line dataKey="ucl" stroke="#332288" strokeOpacity={0.45} strokeDasharray="4 3" dot={false} isAnimationActive={false} name="EWMA upper limit" connectNulls={false} />
            <Line dataKey="lcl" stroke="#332288" strokeOpacity={0.45} strokeDasharray="4 3" dot={false} isAnimationActive={false} name="EWMA lower limit" connectNulls={false} />
            <Line dataKey="projection" stroke="#9f1239" strokeWidth={1.8} strokeDasharray="6 4" dot={false} isAnimationActive={false} name="projection" connectNulls />
            <Scatter dataKey="signal" fill="#9f1239" shape="diamond" isAnimationActive={false} name="signal" />
            <Tooltip content={<TooltipBody unit={trend.unit} />} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <details className="text-xs text-ink-muted">
        <summary className="cursor-pointer">Table of the last {Math.min(30, trend.points.length)} runs</summary>
        <table className="mt-2 w-full text-left">
          <caption className="sr-only">{trend.label} per run</caption>
          <thead>
            <tr>
              <th scope="col">Run</th>
              <th scope="col">Value ({trend.unit})</th>
              <th scope="col">EWMA</th>
              <th scope="col">Signals</th>
            </tr>
          </thead>
          <tbody>
            {trend.points.slice(-30).map((p) => (
              <tr key={p.runId}>
                <td className="num">{fullFmt.format(new Date(p.runAt))}</td>
                <td className="num">{p.value.toFixed(2)}</td>
                <td className="num">{p.ewma?.toFixed(2) ?? "baseline"}</td>
                <td>{p.signals.join(", ")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
