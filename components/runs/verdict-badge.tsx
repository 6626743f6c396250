// A verdict is a word, a shape and a colour, never colour alone.
export type VerdictStatus = "pass" | "marginal" | "fail";

const LABEL: Record<VerdictStatus, string> = { pass: "In window", marginal: "Near the edge", fail: "Out of window" };
export const VERDICT_COLOUR: Record<VerdictStatus, string> = { pass: "#0f766e", marginal: "#b45309", fail: "#9f1239" };

export function VerdictShape({ status, size = 12 }: { status: VerdictStatus; size?: number }) {
  const c = VERDICT_COLOUR[status];
  return (
    <svg width={size} height={size} viewBox="0 0 12 12" aria-hidden="true" className="shrink-0">
      {status === "pass" && <path d="M1.5 6.5 L4.5 9.5 L10.5 2.5" fill="none" stroke={c} strokeWidth="2.2" />}
      {status === "marginal" && <path d="M6 1 L11 11 L1 11 Z" fill={c} />}
      {status === "fail" && <path d="M2 2 L10 10 M10 2 L2 10" stroke={c} strokeWidth="2.4" />}
    </svg>
  );
}

export function VerdictBadge({ status, windowUse }: { status: VerdictStatus; windowUse?: number | null }) {
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border border-paper-line bg-paper-raised px-2.5 py-0.5 text-sm font-semibold" style={{ color: VERDICT_COLOUR[status] }}>
      <VerdictShape status={status} />
      {LABEL[status]}
      {windowUse !== undefined && windowUse !== null ? <span className="num font-normal">{Math.round(windowUse)} %</span> : null}
    </span>
  );
}

export function verdictLabel(status: VerdictStatus): string {
  return LABEL[status];
}
