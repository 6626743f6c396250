"use client";
import type { RunPreview } from "@/lib/runs/preview";
import { VerdictBadge } from "@/components/runs/verdict-badge";
import { CalibrationBadge } from "@/components/runs/calibration-badge";
import { fmt, METRIC_LABELS } from "@/lib/runs/format";

/** Step 3: the board metrics and the verdict, before anything is saved. */
export function ReviewStep({ preview }: { preview: RunPreview }) {
  const b = preview.analysis.board;
  const v = preview.analysis.verdict;
  const rows: [string, string, string][] = [
    ["ΔT at peak", fmt(b.deltaTPeak), "°C"],
    ["Peak, coldest – hottest", `${fmt(b.peakMin)} – ${fmt(b.peakMax)}`, "°C"],
    ["Critical-phase spread", fmt(b.criticalSpread), "°C"],
    ["Time above liquidus", `${fmt(b.talMin, 0)} – ${fmt(b.talMax, 0)}`, "s"],
    ["Soak time", `${fmt(b.soakTimeMin, 0)} – ${fmt(b.soakTimeMax, 0)}`, "s"],
    ["Heat-up rate, slowest", fmt(b.heatUpRate, 2), "°C/s"],
    ["Ramp up / down, largest", `${fmt(b.rampUpMax, 2)} / ${fmt(b.rampDownMax, 2)}`, "°C/s"],
    ["25 °C → peak, longest", fmt(b.timeToPeakMax, 0), "s"],
  ];
  const worst = (Object.entries(v.items) as [keyof typeof METRIC_LABELS, number | null][]).sort((a, c) => (c[1] ?? 1e9) - (a[1] ?? 1e9))[0];
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <VerdictBadge status={v.status} windowUse={v.windowUse} />
        <span className="text-ink-soft">
          against {preview.window.name}
          {worst ? <>; the tightest is {METRIC_LABELS[worst[0]]} at {worst[1] === null ? "a threshold never reached" : `${Math.round(worst[1])} %`}</> : null}.
        </span>
      </p>
      <p className="flex flex-wrap items-center gap-2 text-sm">
        <CalibrationBadge state={preview.calibration.status} />
        <span className="text-ink-muted">
          {preview.instrument
            ? preview.calibration.status === "lapsed"
              ? `${preview.instrument.name}'s calibration had lapsed at the run's time: the run will be saved and flagged, without offsets.`
              : `${preview.instrument.name}: scan skew ${preview.instrument.scanSkewSeconds} s aligned${Object.keys(preview.analysis.meta.offsets).length ? ", calibration offsets applied" : ""}.`
            : "No instrument chosen: no skew alignment or calibration offsets."}
        </span>
      </p>
      <dl className="grid gap-x-6 sm:grid-cols-2">
        {rows.map(([k, val, u]) => (
          <div key={k} className="flex justify-between gap-3 border-b border-paper-line py-1.5 text-sm">
            <dt className="text-ink-muted">{k}</dt>
            <dd><span className="num">{val}</span> <span className="unit">{u}</span></dd>
          </div>
        ))}
      </dl>
      {preview.analysis.meta.warnings.length ? (
        <ul className="list-disc space-y-1 pl-5 text-xs text-health-watch">{preview.analysis.meta.warnings.map((w) => <li key={w}>{w}</li>)}</ul>
      ) : null}
    </div>
  );
}
