export type CalibrationBadgeState = "valid" | "due_soon" | "lapsed" | "none";

const TEXT: Record<CalibrationBadgeState, string> = { valid: "Calibration valid", due_soon: "Calibration due within 30 days", lapsed: "Calibration lapsed", none: "No calibration on record" };
const STYLE: Record<CalibrationBadgeState, string> = {
  valid: "text-health-steady border-health-steady/30",
  due_soon: "text-health-watch border-health-watch/40",
  lapsed: "text-health-act border-health-act/40 bg-red-50",
  none: "text-ink-muted border-paper-line",
};
const MARK: Record<CalibrationBadgeState, string> = { valid: "●", due_soon: "▲", lapsed: "◆", none: "○" };

export function CalibrationBadge({ state, label }: { state: CalibrationBadgeState; label?: string }) {
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-xs font-semibold ${STYLE[state]}`}>
      <span aria-hidden="true">{MARK[state]}</span>
      {label ?? TEXT[state]}
    </span>
  );
}
