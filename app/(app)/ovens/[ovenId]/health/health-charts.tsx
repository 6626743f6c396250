"use client";
import { useState } from "react";
import Link from "next/link";
import { useQueries } from "@tanstack/react-query";
import { TrendChart } from "@/components/drift/trend-chart";
import type { TrendResponse } from "@/db/queries/trends";
import { METRIC_INFO, TRACKED_METRICS } from "@/lib/tracked-metrics";

const PERIODS = [
  { months: 3, label: "3 months" },
  { months: 6, label: "6 months" },
  { months: 12, label: "12 months" },
  { months: 24, label: "All" },
];

async function fetchTrend(ovenId: number, metric: string, from: string): Promise<TrendResponse> {
  const res = await fetch(`/api/v1/ovens/${ovenId}/trends?metric=${metric}&from=${from}`);
  if (!res.ok) throw new Error((await res.json()).error?.message ?? `The trend could not be loaded (${res.status}).`);
  return res.json();
}

function describe(t: TrendResponse) {
  const b = t.baseline;
  const info = METRIC_INFO[t.metric];
  const last = t.points[t.points.length - 1];
  const parts: string[] = [];
  if (last) parts.push(`Last ${last.value.toFixed(info.decimals)} ${t.unit}.`);
  if (b) parts.push(`Baseline ${b.mean.toFixed(info.decimals)} ± ${(3 * b.sigma).toFixed(info.decimals + 1)} ${t.unit} (3σ, ${b.n} runs${b.provisional ? ", provisional" : ""}).`);
  const p = t.projection;
  if (p?.daysToLimit != null && p.daysToLimit > 0) parts.push(`Projected to cross ${p.limit} ${t.unit} in about ${Math.round(p.daysToLimit)} days.`);
  else if (p?.daysToLimit === 0) parts.push(`At or beyond ${p.limit} ${t.unit} on its trend line.`);
  const firing = last?.signals ?? [];
  if (firing.length) parts.push(`Signals on the last run: ${firing.join(", ")}.`);
  return parts.join(" ");
}

export function HealthCharts({ ovenId, now, params }: { ovenId: number; now: number; params: { lambda: number; L: number; cusumK: number; cusumH: number } }) {
  const [months, setMonths] = useState(6);
  const from = new Date(now - months * 30.44 * 86_400_000).toISOString().slice(0, 10);
  const results = useQueries({ queries: TRACKED_METRICS.map((m) => ({ queryKey: ["trend", ovenId, m, from], queryFn: () => fetchTrend(ovenId, m, from) })) });
  return (
    <div className="space-y-4">
      <div className="no-print flex flex-wrap items-center gap-2" role="group" aria-label="Period">
        {PERIODS.map((p) => (
          <button key={p.months} onClick={() => setMonths(p.months)} aria-pressed={months === p.months} className={`min-h-11 rounded-lg border px-3 text-sm font-medium ${months === p.months ? "border-ember bg-ember-soft text-ember-strong" : "border-paper-line bg-paper-raised"}`}>
            {p.label}
          </button>
        ))}
        <span className="text-xs text-ink-muted">▲ orange lines: changes · dotted teal lines: completed work orders · ◆ red: drift signals · dashed red: projection</span>
      </div>
      {results.map((r, i) => {
        const metric = TRACKED_METRICS[i];
        const info = METRIC_INFO[metric];
        return (
          <section key={metric} className="card p-4" aria-labelledby={`trend-${metric}`}>
            <h3 id={`trend-${metric}`} className="font-semibold">
              {info.label} <span className="unit">{info.unit}</span>
            </h3>
            {r.isPending ? <div className="mt-2 h-40 animate-pulse rounded bg-paper-sunk" role="status" aria-label="Loading" /> : null}
            {r.isError ? <p role="alert" className="text-sm text-health-act">{r.error.message}</p> : null}
            {r.data ? (
              r.data.points.length ? (
                <>
                  <p className="mt-1 text-sm text-ink-soft">{describe(r.data)}</p>
                  <TrendChart trend={r.data} now={now} />
                  {r.data.totalPoints > r.data.points.length ? <p className="text-xs text-ink-muted">{r.data.totalPoints} runs, thinned to {r.data.points.length} for the chart.</p> : null}
                </>
              ) : (
                <p className="mt-1 text-sm text-ink-muted">No runs in this period.</p>
              )
            ) : null}
          </section>
        );
      })}
      <p className="text-xs text-ink-muted">
        Limits: individuals ±3σ with σ = average moving range ÷ 1.128; EWMA λ = {params.lambda}, L = {params.L} with exact limits; CUSUM k = {params.cusumK}σ, h = {params.cusumH}σ. A change&apos;s effect is proved on its{" "}
        <Link href={`/ovens/${ovenId}/changes`} className="underline">
          Changes
        </Link>{" "}
        page.
      </p>
    </div>
  );
}
