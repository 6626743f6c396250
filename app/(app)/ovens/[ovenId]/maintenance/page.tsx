import Link from "next/link";
import { desc, eq, inArray, and, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { listPlans } from "@/db/queries/plans";
import { listMeterReadings } from "@/db/queries/meters";
import { workOrders } from "@/db/schema/maintenance";
import { EmptyState } from "@/components/ui/empty-state";
import { SafetyNote } from "@/components/oven/safety-note";
import { buttonClass } from "@/components/ui/button";
import { WorkOrderStateBadge, isOverdue } from "@/components/maintenance/state-badge";
import { nextDue, triggerText } from "@/components/maintenance/plan-text";
import { formatDateTime } from "@/lib/format";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { MeterForm } from "./meter-form";
import { RaiseOrderForm } from "@/components/maintenance/raise-order-form";

export const metadata = { title: "Maintenance" };
export const dynamic = "force-dynamic";

const METER_LABEL = { heater_hours: "Heater hours", conveyor_hours: "Conveyor hours", cycles: "Cycles" } as const;

export default async function OvenMaintenance({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("maintenance.read");
  const { oven, site } = await loadOvenForPage((await params).ovenId);
  const db = await getDb();
  const tz = site.timeZone;
  const now = new Date();
  const [plans, open, recent, meters] = await Promise.all([
    listPlans(db, { ovenId: oven.id }),
    db.select().from(workOrders).where(and(eq(workOrders.ovenId, oven.id), inArray(workOrders.state, ["open", "in_progress", "on_hold"]), sql`${workOrders.dueAt} < ${now.getTime() + 14 * 86_400_000}`)).orderBy(workOrders.dueAt).limit(30),
    db.select().from(workOrders).where(and(eq(workOrders.ovenId, oven.id), inArray(workOrders.state, ["done", "cancelled"]))).orderBy(desc(workOrders.completedAt), desc(workOrders.updatedAt)).limit(10),
    listMeterReadings(db, oven.id, 8),
  ]);
  const orderRow = (o: (typeof open)[number], when: Date | null) => (
    <li key={o.id} className="flex flex-wrap items-center justify-between gap-2 border-b border-paper-line py-2 last:border-0">
      <Link href={`/work-orders/${o.id}`} className="min-w-0 flex-1 text-sm"><span className="font-medium underline">{o.number}</span> {o.title}</Link>
      <span className="num text-xs text-ink-muted">{when ? formatDateTime(when, tz) : "—"}</span>
      <WorkOrderStateBadge state={o.state} overdue={isOverdue(o, now)} />
    </li>
  );
  return (
    <div className="space-y-5">
      <SafetyNote kind="lockout" />
      <div className="flex flex-wrap gap-2">
        <Link href={`/work-orders?ovenId=${oven.id}`} className={buttonClass("secondary")}>All work orders</Link>
        <Link href={`/calendar?ovenId=${oven.id}`} className={buttonClass("secondary")}>Calendar</Link>
        {can(actor.role, "plan.manage") ? <Link href="/plans/new" className={buttonClass("secondary")}>New plan</Link> : null}
      </div>
      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card p-4" aria-label="Open work orders">
          <h2 className="mb-1 text-base font-semibold">Open, due in the next 14 days or overdue <span className="num text-ink-muted">({open.length})</span></h2>
          {open.length ? <ul>{open.map((o) => orderRow(o, o.dueAt))}</ul> : <p className="text-sm text-ink-muted">Nothing open.</p>}
        </section>
        <section className="card p-4" aria-label="Recent work orders">
          <h2 className="mb-1 text-base font-semibold">Recently finished</h2>
          {recent.length ? <ul>{recent.map((o) => orderRow(o, o.completedAt ?? o.updatedAt))}</ul> : <p className="text-sm text-ink-muted">None yet.</p>}
        </section>
      </div>
      <section className="card overflow-x-auto p-4" aria-label="Plans" tabIndex={0}>
        <h2 className="mb-2 text-base font-semibold">Plans</h2>
        {plans.length === 0 ? <EmptyState title="No plans yet">Add preventive plans (flux and exhaust cleaning, conveyor lubrication, blower checks, calibration) for {oven.tag}.</EmptyState> : (
          <table className="w-full min-w-[560px] text-left text-sm">
            <thead className="text-xs uppercase tracking-wide text-ink-muted"><tr><th className="py-1 pr-3">Plan</th><th className="py-1 pr-3">Trigger</th><th className="py-1">Next due</th></tr></thead>
            <tbody>
              {plans.map(({ plan: p }) => {
                const next = nextDue(p, tz, now);
                return (
                  <tr key={p.id} className="border-t border-paper-line">
                    <td className="py-2 pr-3">{p.title}{p.safetyLockout ? <span className="ml-2 rounded border border-health-watch/50 px-1 text-xs text-health-watch" title="Lock-out/tag-out applies">LOTO</span> : null}</td>
                    <td className="py-2 pr-3">{triggerText(p, tz)}</td>
                    <td className="num py-2">{next ? formatDateTime(next, tz) : "—"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </section>
      {can(actor.role, "workorder.create") ? (
        <section className="card p-4" aria-label="Report a problem">
          <h2 className="mb-2 text-base font-semibold">Report a problem</h2>
          <RaiseOrderForm ovenId={oven.id} />
        </section>
      ) : null}
      <section className="card p-4" aria-label="Meter readings">
        <h2 className="mb-2 text-base font-semibold">Meter readings</h2>
        {meters.length ? (
          <ul className="mb-3 text-sm">
            {meters.map((m) => <li key={m.id} className="flex justify-between gap-3 border-b border-paper-line py-1 last:border-0"><span>{METER_LABEL[m.kind]}</span><span><span className="num">{m.value.toLocaleString("en-GB")}</span><span className="unit">{m.kind === "cycles" ? "" : "h"}</span> <span className="text-xs text-ink-muted">{formatDateTime(m.at, tz)}</span></span></li>)}
          </ul>
        ) : <p className="mb-3 text-sm text-ink-muted">No readings yet.</p>}
        {can(actor.role, "meter.record") ? <MeterForm ovenId={oven.id} /> : null}
      </section>
    </div>
  );
}
