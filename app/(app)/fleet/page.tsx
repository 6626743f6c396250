import Link from "next/link";
import { getDb } from "@/db";
import { fleetView } from "@/db/queries/fleet-view";
import { listSitesWithLines } from "@/db/queries/sites";
import { maintenanceKpis } from "@/db/queries/maintenance-kpis";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button";
import { HealthBadge } from "@/components/oven/health-badge";
import { Sparkline } from "@/components/drift/sparkline";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { fleetFilterSchema } from "@/lib/validation/oven";
import { formatAgo } from "@/lib/format";
import { FleetFilters } from "./fleet-filters";

export const metadata = { title: "Fleet" };

const PERIODS: Record<string, number> = { "30d": 30, "90d": 90, "365d": 365 };

function Tile({ label, value, unit, note }: { label: string; value: string; unit?: string; note?: string }) {
  return (
    <div className="card p-4">
      <p className="text-xs font-semibold uppercase tracking-wider text-ink-muted">{label}</p>
      <p className="mt-1 text-2xl font-semibold">
        <span className="num">{value}</span>
        {unit ? <span className="unit text-base">{unit}</span> : null}
      </p>
      {note ? <p className="mt-1 text-xs text-ink-muted">{note}</p> : null}
    </div>
  );
}

const VERDICT_STYLE: Record<string, string> = { pass: "text-health-steady", marginal: "text-health-watch", fail: "text-health-act" };

export default async function FleetPage({ searchParams }: { searchParams: Promise<Record<string, string>> }) {
  const actor = await requirePermission("fleet.read");
  const raw = await searchParams;
  const parsed = fleetFilterSchema.safeParse(raw);
  const filter = parsed.success ? parsed.data : {};
  const days = PERIODS[raw.period ?? "30d"] ?? 30;
  const now = new Date();
  const db = await getDb();
  const [rows, sites, kpis] = await Promise.all([
    fleetView(db, { siteId: filter.siteId, lineId: filter.lineId }, now),
    listSitesWithLines(db),
    maintenanceKpis(db, { from: new Date(now.getTime() - days * 86_400_000), to: now, now }),
  ]);
  const active = rows.filter((r) => r.serviceState !== "retired");
  const shown = rows
    .filter((r) => (filter.state ? r.serviceState === filter.state : r.serviceState !== "retired"))
    .filter((r) => !filter.q || r.tag.includes(filter.q.toUpperCase()) || r.name.toLowerCase().includes(filter.q.toLowerCase()));
  const k = kpis.fleet;
  const openAlerts = active.reduce((s, r) => s + r.openAlerts, 0);
  return (
    <>
      <PageHeader
        title="Fleet"
        subtitle={`${active.length} ovens in the fleet · ${active.filter((r) => r.state === "act" || r.state === "down").length} need action · ${active.filter((r) => r.state === "watch").length} on watch`}
        actions={can(actor.role, "oven.create") ? <Link href="/ovens/new" className={buttonClass("primary")}>Add an oven</Link> : null}
      />
      <nav aria-label="Period" className="no-print mb-3 flex gap-2 text-sm">
        {Object.keys(PERIODS).map((p) => (
          <Link key={p} href={`/fleet?${new URLSearchParams({ ...raw, period: p })}`} aria-current={(raw.period ?? "30d") === p ? "true" : undefined} className={`min-h-11 rounded-lg border px-3 py-2.5 ${(raw.period ?? "30d") === p ? "border-ember bg-ember-soft text-ember-strong" : "border-paper-line bg-paper-raised"}`}>
            Last {PERIODS[p]} days
          </Link>
        ))}
      </nav>
      <section aria-label="Fleet figures" className="mb-6 grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Tile label="PM compliance" value={k.pmCompliance.value == null ? "—" : (k.pmCompliance.value * 100).toFixed(0)} unit={k.pmCompliance.value == null ? undefined : "%"} note={k.pmCompliance.value == null ? k.pmCompliance.reason : `${k.pmCompliance.doneOnTime} of ${k.pmCompliance.due} on time`} />
        <Tile label="MTBF" value={k.mtbfHours.value == null ? "—" : k.mtbfHours.value.toFixed(0)} unit={k.mtbfHours.value == null ? undefined : "h"} note={k.mtbfHours.value == null ? k.mtbfHours.reason : `${k.breakdowns.breakdowns} breakdowns`} />
        <Tile label="MTTR" value={k.mttrMinutes.value == null ? "—" : k.mttrMinutes.value.toFixed(0)} unit={k.mttrMinutes.value == null ? undefined : "min"} note={k.mttrMinutes.value == null ? k.mttrMinutes.reason : undefined} />
        <Tile label="Open alerts" value={String(openAlerts)} note={openAlerts ? "See the alerts inbox" : "Nothing to acknowledge"} />
      </section>
      <FleetFilters sites={sites} filter={filter} />
      {shown.length === 0 ? (
        <EmptyState title={rows.length ? "No oven matches these filters" : "No ovens yet"}>
          {rows.length ? "Clear a filter to see more of the fleet." : "An engineer adds each oven with its tag, kind and line. Its runs and maintenance then collect on its page."}
        </EmptyState>
      ) : (
        <ul className="grid gap-2" aria-label="Ovens, worst state first">
          {shown.map((o) => (
            <li key={o.id}>
              <Link href={`/ovens/${o.id}/health`} className="card grid gap-2 p-4 hover:border-ember-ring md:grid-cols-[6.5rem_1fr_8rem_11rem_8rem] md:items-center md:gap-4">
                <span className="flex items-center justify-between md:block">
                  <HealthBadge state={o.state} />
                  <span className="text-lg font-semibold tracking-wide md:hidden">{o.tag}</span>
                </span>
                <span className="min-w-0">
                  <span className="hidden text-lg font-semibold tracking-wide md:block">{o.tag}</span>
                  <span className="block truncate text-sm">{o.name} · {o.line.name}</span>
                  <span className="block text-sm text-ink-muted">{o.reasons[0]}</span>
                </span>
                <Sparkline points={o.deltaT} limit={o.deltaTLimit} label={`${o.tag} ΔT at peak, last 30 days`} />
                <span className="text-sm">
                  {o.lastRun ? (
                    <>
                      Last run {formatAgo(new Date(o.lastRun.runAt), now)} · <span className="whitespace-nowrap">
                        <span className={`font-semibold ${VERDICT_STYLE[o.lastRun.verdict] ?? ""}`}>{o.lastRun.verdict}</span>
                        {o.lastRun.windowUse != null ? <span className="num text-ink-muted"> {o.lastRun.windowUse.toFixed(0)} %</span> : null}
                      </span>
                    </>
                  ) : (
                    <span className="text-ink-muted">No runs yet</span>
                  )}
                </span>
                <span className="text-sm text-ink-muted">
                  <span className="num">{o.openWorkOrders}</span> open{o.overdueWorkOrders ? <span className="font-semibold text-health-act"> · <span className="num">{o.overdueWorkOrders}</span> overdue</span> : null}
                  <br />
                  <span className="num">{o.openAlerts}</span> alert{o.openAlerts === 1 ? "" : "s"}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
