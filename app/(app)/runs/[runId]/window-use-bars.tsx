import { METRIC_LABELS } from "@/lib/runs/format";
import type { VerdictItems } from "@/lib/thermal/types";

/** One bar per window-use item: how much of the allowed half-window (or limit) the value uses. */
export function WindowUseBars({ items }: { items: VerdictItems }) {
  const entries = (Object.keys(METRIC_LABELS) as (keyof typeof METRIC_LABELS)[]).filter((k) => k in items).map((k) => [k, items[k] ?? null] as const);
  return (
    <ul className="space-y-2">
      {entries.map(([key, use]) => {
        const status = use === null || use > 100 ? "fail" : use > 90 ? "marginal" : "pass";
        const colour = status === "fail" ? "bg-health-act" : status === "marginal" ? "bg-health-watch" : "bg-health-steady";
        return (
          <li key={key} className="grid grid-cols-[9.5rem_1fr_4rem] items-center gap-2 text-sm">
            <span className="text-ink-soft">{METRIC_LABELS[key]}</span>
            <span className="relative h-3 overflow-hidden rounded bg-paper-sunk" aria-hidden="true">
              <span className={`absolute inset-y-0 left-0 ${colour}`} style={{ width: `${Math.min(100, use ?? 100)}%` }} />
              <span className="absolute inset-y-0 border-r border-ink/40" style={{ left: "90%" }} />
            </span>
            <span className="num text-right">{use === null ? "not reached" : `${Math.round(use)} %`}</span>
          </li>
        );
      })}
    </ul>
  );
}
