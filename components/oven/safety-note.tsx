// The usual cautions of the trade. Ovenward supports qualified people; it does not replace them.
export const CAUTIONS = {
  lockout:
    "Before maintenance on an oven: isolate and lock out power, let the chamber cool, and follow the site's lock-out/tag-out procedure and local electrical codes. Heater and wiring work is for qualified people.",
  fumes: "Flux fumes are a respiratory hazard: keep extraction running and filters serviced.",
  nitrogen: "Ovens with a nitrogen atmosphere carry an oxygen-depletion risk in enclosed spaces.",
  modification:
    "Modifying heating, wiring or airflow may void the equipment's safety certification. Follow the maker's guidance and local codes.",
  verdicts:
    "Ovenward's verdicts support, and do not replace, the paste maker's and component makers' specifications and the plant's qualified process owners.",
} as const;

export function SafetyNote({ kind }: { kind: keyof typeof CAUTIONS }) {
  return (
    <aside role="note" aria-label="Safety" className="flex gap-3 rounded-card border border-health-watch/40 bg-amber-50 p-3 text-sm text-ink">
      <svg width="18" height="18" viewBox="0 0 12 12" aria-hidden="true" className="mt-0.5 shrink-0">
        <path d="M6 1 L11 11 L1 11 Z" fill="none" stroke="#b45309" strokeWidth="1.4" />
        <path d="M6 4.5 V7.5 M6 9 V9.4" stroke="#b45309" strokeWidth="1.4" strokeLinecap="round" />
      </svg>
      <p>{CAUTIONS[kind]}</p>
    </aside>
  );
}
