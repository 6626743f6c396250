import Link from "next/link";
import { getDb } from "@/db";
import { listAlerts } from "@/db/queries/alerts";
import { listOvens } from "@/db/queries/ovens";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { HealthBadge } from "@/components/oven/health-badge";
import { buttonClass } from "@/components/ui/button";
import { FilterSelect } from "@/components/ui/filter-select";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { alertQuerySchema } from "@/lib/validation/drift";
import { formatAgo } from "@/lib/format";
import { AcknowledgeForm } from "./acknowledge-form";

export const metadata = { title: "Alerts" };

export default async function AlertsPage({ searchParams }: { searchParams: Promise<Record<string, string>> }) {
  const actor = await requirePermission("alert.read");
  const raw = await searchParams;
  const q = alertQuerySchema.safeParse(raw);
  const filter = q.success ? q.data : { status: "open" as const };
  const db = await getDb();
  const [rows, ovens] = await Promise.all([listAlerts(db, filter), listOvens(db)]);
  return (
    <>
      <PageHeader title="Alerts" subtitle="Raised when an oven's health worsens. Acknowledge with a note; turn one into a drift investigation." />
      <form method="get" className="mb-4 flex flex-wrap items-end gap-3" aria-label="Filter alerts">
        <FilterSelect label="Oven" name="ovenId" defaultValue={raw.ovenId} anyLabel="All ovens" options={ovens.map((o) => ({ value: o.oven.id, label: o.oven.tag }))} />
        <FilterSelect label="Status" name="status" defaultValue={filter.status} options={[{ value: "open", label: "Open" }, { value: "acknowledged", label: "Acknowledged" }, { value: "all", label: "All" }]} />
        <button className={buttonClass("secondary")}>Apply</button>
      </form>
      {rows.length === 0 ? (
        <EmptyState title={filter.status === "open" ? "No open alerts" : "No alerts match"}>When an oven moves to Watch, Act or Down, an alert appears here.</EmptyState>
      ) : (
        <ul className="grid gap-3">
          {rows.map(({ alert: a, oven, by }) => (
            <li key={a.id} className="card p-4">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <p className="flex flex-wrap items-center gap-2 font-semibold">
                  <Link href={`/ovens/${oven.id}/health`} className="tracking-wide underline">
                    {oven.tag}
                  </Link>
                  <HealthBadge state={a.toState} />
                  {a.fromState ? <span className="text-sm font-normal text-ink-muted">from {a.fromState}</span> : null}
                </p>
                <time className="text-sm text-ink-muted" dateTime={a.raisedAt.toISOString()}>
                  {formatAgo(a.raisedAt)}
                </time>
              </div>
              <ul className="mt-2 list-disc pl-5 text-sm">
                {a.reasons.map((r) => (
                  <li key={r}>{r}</li>
                ))}
              </ul>
              {a.acknowledgedAt ? (
                <p className="mt-2 text-sm text-ink-muted">
                  Acknowledged {formatAgo(a.acknowledgedAt)} by {by?.name ?? by?.email}: {a.note}
                  {a.workOrderId ? (
                    <>
                      {" "}
                      · <Link href={`/work-orders/${a.workOrderId}`} className="underline">work order</Link>
                    </>
                  ) : null}
                </p>
              ) : can(actor.role, "alert.acknowledge") ? (
                <AcknowledgeForm alertId={a.id} canOpenWorkOrder={can(actor.role, "workorder.create")} />
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
