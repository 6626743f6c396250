import Link from "next/link";
import { notFound } from "next/navigation";
import { and, asc, eq, inArray } from "drizzle-orm";
import { getDb } from "@/db";
import { getPlan } from "@/db/queries/plans";
import { workOrders } from "@/db/schema/maintenance";
import { PageHeader } from "@/components/ui/page-header";
import { WorkOrderCautions } from "@/components/maintenance/work-order-cautions";
import { WorkOrderStateBadge, isOverdue } from "@/components/maintenance/state-badge";
import { nextDue, triggerText } from "@/components/maintenance/plan-text";
import { formatDateTime } from "@/lib/format";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { PlanEditForm } from "./plan-edit-form";

export const metadata = { title: "Plan" };
export const dynamic = "force-dynamic";

export default async function PlanPage({ params }: { params: Promise<{ planId: string }> }) {
  const actor = await requirePermission("maintenance.read");
  const id = Number((await params).planId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const db = await getDb();
  const found = await getPlan(db, id);
  if (!found) notFound();
  const { plan: p, ovenTag, timeZone } = found;
  const now = new Date();
  const open = await db.select().from(workOrders).where(and(eq(workOrders.planId, id), inArray(workOrders.state, ["open", "in_progress", "on_hold"]))).orderBy(asc(workOrders.dueAt)).limit(20);
  const next = nextDue(p, timeZone, now);
  return (
    <div className="max-w-3xl space-y-5">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-muted"><Link href="/plans" className="underline">Plans</Link> / {ovenTag}</nav>
      <PageHeader title={p.title} subtitle={`${ovenTag} · ${p.kind} · ${triggerText(p, timeZone)}${next ? ` · next ${formatDateTime(next, timeZone)}` : ""}${p.active ? "" : " · paused"}`} />
      <WorkOrderCautions lockout={p.safetyLockout} title={p.title} />
      {p.instructions ? <section className="card p-4"><h2 className="mb-1 text-base font-semibold">Instructions</h2><p className="whitespace-pre-wrap text-sm">{p.instructions}</p></section> : null}
      <section className="card p-4" aria-label="Checklist">
        <h2 className="mb-1 text-base font-semibold">Checklist</h2>
        {p.checklist.length ? <ul className="list-disc pl-5 text-sm">{p.checklist.map((c) => <li key={c.id}>{c.label}{c.mandatory ? "" : " (optional)"}</li>)}</ul> : <p className="text-sm text-ink-muted">None.</p>}
      </section>
      <section className="card p-4" aria-label="Unfinished orders">
        <h2 className="mb-1 text-base font-semibold">Unfinished orders from this plan</h2>
        {open.length ? (
          <ul className="text-sm">
            {open.map((o) => (
              <li key={o.id} className="flex flex-wrap items-center justify-between gap-2 border-b border-paper-line py-1.5 last:border-0">
                <Link className="underline" href={`/work-orders/${o.id}`}>{o.number}</Link>
                <span className="num text-ink-muted">{o.dueAt ? formatDateTime(o.dueAt, timeZone) : "—"}</span>
                <WorkOrderStateBadge state={o.state} overdue={isOverdue(o, now)} />
              </li>
            ))}
          </ul>
        ) : <p className="text-sm text-ink-muted">None.</p>}
      </section>
      {can(actor.role, "plan.manage") ? (
        <section className="card p-4" aria-label="Edit plan">
          <h2 className="mb-2 text-base font-semibold">Edit</h2>
          <p className="mb-3 text-sm text-ink-muted">A new rule or start replaces only future orders nobody has touched; past and started work stays as it is.</p>
          <PlanEditForm plan={{ id: p.id, version: p.version, title: p.title, estimatedMinutes: p.estimatedMinutes, active: p.active, rrule: p.rrule, dtstart: p.dtstartLocal }} timeZone={timeZone} />
        </section>
      ) : null}
    </div>
  );
}
