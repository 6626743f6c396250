import { SERVICE_STATE_LABELS } from "@/lib/validation/oven";
import type { ServiceState } from "@/db/schema/fleet";

const STYLE: Record<ServiceState, string> = {
  in_service: "border-health-steady/30 text-health-steady",
  down: "border-health-down/40 text-health-down",
  retired: "border-paper-line text-ink-muted line-through decoration-1",
};

export function ServiceStateBadge({ state }: { state: ServiceState }) {
  return <span className={`inline-flex items-center rounded-md border bg-paper-raised px-2 py-0.5 text-xs font-semibold ${STYLE[state]}`}>{SERVICE_STATE_LABELS[state]}</span>;
}
