// The one health badge: a word, a shape and a colour, never colour alone.
export type HealthState = "steady" | "watch" | "act" | "down";

const LABEL: Record<HealthState, string> = { steady: "Steady", watch: "Watch", act: "Act", down: "Down" };
const COLOUR: Record<HealthState, string> = { steady: "#0f766e", watch: "#b45309", act: "#9f1239", down: "#57534e" };

export function HealthShape({ state, size = 12 }: { state: HealthState; size?: number }) {
  const c = COLOUR[state];
  return (
    <svg width={size} height={size} viewBox="0 0 12 12" aria-hidden="true" className="shrink-0">
      {state === "steady" && <circle cx="6" cy="6" r="5" fill={c} />}
      {state === "watch" && <path d="M6 1 L11 11 L1 11 Z" fill={c} />}
      {state === "act" && <path d="M6 0.5 L11.5 6 L6 11.5 L0.5 6 Z" fill={c} />}
      {state === "down" && (
        <>
          <rect x="1.5" y="1.5" width="9" height="9" fill="none" stroke={c} strokeWidth="1.6" />
          <path d="M1.5 10.5 L10.5 1.5" stroke={c} strokeWidth="1.6" />
        </>
      )}
    </svg>
  );
}

export function HealthBadge({ state }: { state: HealthState }) {
  return (
    <span className="inline-flex items-center gap-1.5 rounded-full border border-paper-line bg-paper-raised px-2.5 py-0.5 text-sm font-semibold" style={{ color: COLOUR[state] }}>
      <HealthShape state={state} />
      {LABEL[state]}
    </span>
  );
}
