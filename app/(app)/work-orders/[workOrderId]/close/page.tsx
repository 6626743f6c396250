import Link from "next/link";
import { redirect } from "next/navigation";
import { requirePermission } from "@/lib/session";
import { formatDateTime } from "@/lib/format";
import { KIND_LABELS } from "@/lib/maintenance/work-order-state";
import { WorkOrderCautions } from "@/components/maintenance/work-order-cautions";
import { loadWorkOrderPage } from "../load";
import { CloseForm } from "./close-form";

export const metadata = { title: "Close work order" };
export const dynamic = "force-dynamic";

export default async function CloseWorkOrderPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  await requirePermission("workorder.update");
  const { order, oven, parts } = await loadWorkOrderPage((await params).workOrderId);
  if (order.state === "done" || order.state === "cancelled") redirect(`/work-orders/${order.id}`);
  return (
    <div className="mx-auto max-w-xl space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-muted">
        <Link href="/my-work" className="underline">My work</Link> / <Link href={`/work-orders/${order.id}`} className="underline">{order.number}</Link>
      </nav>
      <header>
        <p className="text-sm font-semibold tracking-wide text-ink-soft">{oven.oven.tag} · {KIND_LABELS[order.kind]}</p>
        <h1 className="text-xl font-semibold leading-snug tracking-tight">{order.title}</h1>
        {order.dueAt ? <p className="text-sm text-ink-muted">Due {formatDateTime(order.dueAt, oven.site.timeZone)}</p> : null}
      </header>
      <WorkOrderCautions lockout={order.safetyLockout} title={order.title} />
      <CloseForm
        order={{
          id: order.id,
          number: order.number,
          version: order.version,
          state: order.state,
          kind: order.kind,
          checklist: order.checklist,
          checklistResults: order.checklistResults,
          notes: order.notes ?? "",
          labourMinutes: order.labourMinutes,
          downtimeMinutes: order.downtimeMinutes,
          breakdown: order.breakdown,
          parts: parts.map((p) => ({ description: p.description, quantity: p.quantity })),
        }}
      />
    </div>
  );
}
