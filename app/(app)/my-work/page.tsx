import Link from "next/link";
import { getDb } from "@/db";
import { listMyWork } from "@/db/queries/work-orders";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button";
import { WorkOrderStateBadge, isOverdue } from "@/components/maintenance/state-badge";
import { formatAgo, formatDateTime } from "@/lib/format";
import { requirePermission } from "@/lib/session";
import { StartButton } from "./start-button";

export const metadata = { title: "My work" };
/** Yours due within this many days (anyone's only when due within a day). */
const MY_DAYS = 3;
const DAY_MS = 86_400_000;
export const dynamic = "force-dynamic";

export default async function MyWorkPage() {
  const actor = await requirePermission("workorder.update");
  const now = new Date();
  const rows = await listMyWork(await getDb(), actor.userId, now, MY_DAYS);
  // Overdue first (oldest first), then the rest by due time; work already started leads each group.
  const sorted = [...rows].sort((a, b) => {
    const ao = isOverdue(a.order, now) ? 0 : 1;
    const bo = isOverdue(b.order, now) ? 0 : 1;
    if (ao !== bo) return ao - bo;
    return (a.order.dueAt?.getTime() ?? Infinity) - (b.order.dueAt?.getTime() ?? Infinity);
  });
  const overdue = sorted.filter((r) => isOverdue(r.order, now));
  const today = sorted.filter((r) => !isOverdue(r.order, now) && (r.order.dueAt?.getTime() ?? Infinity) < now.getTime() + DAY_MS);
  const later = sorted.filter((r) => !overdue.includes(r) && !today.includes(r));
  const groups = [
    { title: "Overdue", rows: overdue },
    { title: "Due today", rows: today },
    { title: `Coming ${MY_DAYS} days`, rows: later },
  ].filter((g) => g.rows.length > 0);
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeader
        title="My work"
        subtitle={`${sorted.length} order${sorted.length === 1 ? "" : "s"}: yours due within ${MY_DAYS} days, and anyone's due today${overdue.length ? ` · ${overdue.length} overdue` : ""}`}
      />
      {sorted.length === 0 ? (
        <EmptyState title="Nothing due">No work orders are assigned to you for the next {MY_DAYS} days, and none is waiting for someone today.</EmptyState>
      ) : (
        groups.map((g) => (
        <section key={g.title} aria-label={g.title} className="mb-6">
        <h2 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-muted">
          {g.title} <span className="num font-normal">({g.rows.length})</span>
        </h2>
        <ul className="space-y-3" aria-label={`Work orders: ${g.title.toLowerCase()}`}>
          {g.rows.map(({ order: o, ovenTag, timeZone, assigneeName }) => {
            const late = isOverdue(o, now);
            return (
              <li key={o.id} className={`card p-3 ${late ? "border-health-act/40" : ""}`} data-testid="my-work-item">
                <div className="flex items-start justify-between gap-3">
                  <Link href={`/work-orders/${o.id}`} className="min-w-0 flex-1">
                    <p className="text-sm font-semibold tracking-wide text-ink">
                      {ovenTag} <span className="font-normal text-ink-muted">· {o.number}</span>
                    </p>
                    <p className="mt-0.5 text-base leading-snug text-ink">{o.title}</p>
                    <p className="mt-1 text-sm text-ink-muted">
                      {o.dueAt ? (
                        <time dateTime={o.dueAt.toISOString()} title={formatDateTime(o.dueAt, timeZone)}>
                          Due {formatAgo(o.dueAt, now)}
                        </time>
                      ) : (
                        "No due time"
                      )}
                      {assigneeName ? ` · ${assigneeName}` : " · not assigned"}
                    </p>
                  </Link>
                  <WorkOrderStateBadge state={o.state} overdue={late} />
                </div>
                <div className="mt-3">
                  {o.state === "open" ? (
                    <StartButton id={o.id} version={o.version} label={`Start ${o.number}`} />
                  ) : (
                    <Link href={`/work-orders/${o.id}/close`} className={buttonClass("primary", "min-h-12 w-full text-base")}>
                      {o.state === "on_hold" ? "Resume and close" : "Close"}
                    </Link>
                  )}
                </div>
              </li>
            );
          })}
        </ul>
        </section>
        ))
      )}
    </div>
  );
}
