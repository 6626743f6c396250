import { STATE_LABELS, type WorkOrderState } from "@/lib/maintenance/work-order-state";

// A word and a shape for each state, so the state never rests on colour alone.
const LOOK: Record<WorkOrderState | "overdue", { cls: string; shape: React.ReactNode }> = {
  open: { cls: "border-ink-faint text-ink-soft", shape: <circle cx="5" cy="5" r="3.5" fill="none" stroke="currentColor" strokeWidth="1.5" /> },
  in_progress: { cls: "border-ember/50 text-ember-strong", shape: <path d="M5 1.5 A3.5 3.5 0 0 1 5 8.5 Z" fill="currentColor" stroke="currentColor" strokeWidth="1" /> },
  on_hold: { cls: "border-health-watch/50 text-health-watch", shape: <path d="M3 2 V8 M7 2 V8" stroke="currentColor" strokeWidth="1.8" /> },
  done: { cls: "border-health-steady/50 text-health-steady", shape: <path d="M1.5 5.2 L4 7.7 L8.5 2.5" fill="none" stroke="currentColor" strokeWidth="1.8" /> },
  cancelled: { cls: "border-health-down/40 text-health-down", shape: <path d="M2 2 L8 8 M8 2 L2 8" stroke="currentColor" strokeWidth="1.5" /> },
  overdue: { cls: "border-health-act/50 bg-red-50 text-health-act", shape: <path d="M5 1 L9 9 L1 9 Z" fill="none" stroke="currentColor" strokeWidth="1.4" /> },
};

export function WorkOrderStateBadge({ state, overdue = false }: { state: WorkOrderState; overdue?: boolean }) {
  const key = overdue && (state === "open" || state === "in_progress" || state === "on_hold") ? "overdue" : state;
  const look = LOOK[key];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-semibold ${look.cls}`}>
      <svg width="10" height="10" viewBox="0 0 10 10" aria-hidden="true">{look.shape}</svg>
      {key === "overdue" ? `overdue · ${STATE_LABELS[state]}` : STATE_LABELS[state]}
    </span>
  );
}

export function isOverdue(o: { state: string; dueAt: Date | string | null }, now: Date) {
  if (!o.dueAt || !(o.state === "open" || o.state === "in_progress" || o.state === "on_hold")) return false;
  return new Date(o.dueAt).getTime() < now.getTime();
}
