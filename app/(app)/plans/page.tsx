import Link from "next/link";
import { getDb } from "@/db";
import { listPlans } from "@/db/queries/plans";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { GenerateButton } from "@/components/maintenance/generate-button";
import { nextDue, triggerText } from "@/components/maintenance/plan-text";
import { formatDateTime } from "@/lib/format";

export const metadata = { title: "Plans" };
export const dynamic = "force-dynamic";

export default async function PlansPage() {
  const actor = await requirePermission("maintenance.read");
  const rows = await listPlans(await getDb());
  const now = new Date();
  return (
    <>
      <PageHeader
        title="Plans"
        subtitle="Preventive and calibration plans, per oven. Work orders are made from them ahead of their due time."
        actions={
          <>
            {can(actor.role, "maintenance.generate") ? <GenerateButton /> : null}
            {can(actor.role, "plan.manage") ? <Link href="/plans/new" className={buttonClass("primary")}>New plan</Link> : null}
          </>
        }
      />
      {rows.length === 0 ? <EmptyState title="No plans yet">Add a plan for one oven or several at once.</EmptyState> : (
        <div className="card overflow-x-auto" role="region" aria-label="Plans" tabIndex={0}>
          <table className="w-full min-w-[640px] text-left text-sm">
            <thead className="border-b border-paper-line bg-paper-sunk/60 text-xs uppercase tracking-wide text-ink-muted">
              <tr><th className="px-3 py-2">Oven</th><th className="px-3 py-2">Plan</th><th className="px-3 py-2">Trigger</th><th className="px-3 py-2">Next due</th><th className="px-3 py-2">Est.</th></tr>
            </thead>
            <tbody>
              {rows.map(({ plan: p, ovenTag, timeZone }) => {
                const next = nextDue(p, timeZone, now);
                return (
                  <tr key={p.id} className="border-b border-paper-line last:border-0">
                    <td className="px-3 py-2 font-semibold"><Link className="underline" href={`/ovens/${p.ovenId}/maintenance`}>{ovenTag}</Link></td>
                    <td className="px-3 py-2"><Link className="underline" href={`/plans/${p.id}`}>{p.title}</Link>{p.safetyLockout ? <span className="ml-2 rounded border border-health-watch/50 px-1 text-xs text-health-watch" title="Lock-out/tag-out applies">LOTO</span> : null}{!p.active ? <span className="ml-2 text-xs text-ink-muted">(paused)</span> : null}</td>
                    <td className="px-3 py-2">{triggerText(p, timeZone)}</td>
                    <td className="px-3 py-2 num whitespace-nowrap">{next ? formatDateTime(next, timeZone) : "—"}</td>
                    <td className="px-3 py-2"><span className="num">{p.estimatedMinutes ?? "—"}</span><span className="unit">min</span></td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
