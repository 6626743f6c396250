import { getDb } from "@/db";
import { listOvens } from "@/db/queries/ovens";
import { maintenanceKpis } from "@/db/queries/maintenance-kpis";
import { PageHeader } from "@/components/ui/page-header";
import { Button } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { KPI_DEFINITIONS } from "@/lib/maintenance/kpi-definitions";
import { BACKLOG_BUCKETS, type Kpi } from "@/lib/maintenance/kpis";
import { localDateKey, wallMsToInstant } from "@/lib/maintenance/wall-time";
import { kpiQuerySchema } from "@/lib/validation/maintenance";

export const metadata = { title: "Maintenance KPIs" };
export const dynamic = "force-dynamic";

const DAY = 86_400_000;
const startOfLocalDay = (date: string, tz: string) => wallMsToInstant(Date.parse(`${date}T00:00:00Z`), tz).instant;
const pct = (k: Kpi) => (k.value === null ? "none" : `${(k.value * 100).toFixed(1)}`);
const num = (k: Kpi, digits = 0) => (k.value === null ? "none" : k.value.toFixed(digits));

function Tile({ label, value, unit, detail, testId }: { label: string; value: string; unit?: string; detail?: React.ReactNode; testId?: string }) {
  return (
    <div className="card p-4" data-testid={testId}>
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-muted">{label}</p>
      <p className="mt-1 text-2xl font-semibold"><span className="num">{value}</span>{unit && value !== "none" ? <span className="unit text-base">{unit}</span> : null}</p>
      {detail ? <p className="mt-1 text-xs text-ink-muted">{detail}</p> : null}
    </div>
  );
}

export default async function MaintenanceKpisPage({ searchParams }: { searchParams: Promise<Record<string, string>> }) {
  await requirePermission("maintenance.read");
  const parsed = kpiQuerySchema.safeParse(await searchParams);
  const db = await getDb();
  const now = new Date();
  // The plant's zone decides where its days begin (one site today; per-site periods come with more sites).
  const tz = (await listOvens(db))[0]?.site.timeZone ?? "UTC";
  const q = parsed.success ? parsed.data : {};
  const toDate = q.to ?? localDateKey(now, tz);
  const fromDate = q.from ?? localDateKey(new Date(now.getTime() - 89 * DAY), tz);
  const from = startOfLocalDay(fromDate, tz);
  const to = new Date(startOfLocalDay(toDate, tz).getTime() + DAY);
  const bad = !parsed.success || !(to > from);
  const { fleet, perOven } = await maintenanceKpis(db, bad ? { from: new Date(now.getTime() - 90 * DAY), to: now, now } : { from, to, now });
  const pm = fleet.pmCompliance;
  return (
    <>
      <PageHeader title="Maintenance KPIs" subtitle={`From ${fromDate} to ${toDate} inclusive (site time, ${tz}). Backlog is as of now.`} />
      <form className="card mb-5 flex flex-wrap items-end gap-3 p-3" method="get">
        <label className="text-sm">From<br /><input type="date" name="from" defaultValue={fromDate} className="min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2" /></label>
        <label className="text-sm">To<br /><input type="date" name="to" defaultValue={toDate} className="min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2" /></label>
        <Button type="submit">Show period</Button>
        {bad ? <p role="alert" className="text-sm text-health-act">The period needs a start before its end, as YYYY-MM-DD; showing the last 90 days.</p> : null}
      </form>
      <section aria-label="Fleet" className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        <Tile testId="kpi-pm" label="PM compliance" value={pct(pm)} unit="%" detail={<><span className="num">{pm.doneOnTime}</span> of <span className="num">{pm.due}</span> done on time · <span className="num" data-testid="pm-late">{fleet.doneLate}</span> done late · <span className="num" data-testid="pm-not-done">{fleet.notDone}</span> not done</>} />
        <Tile label="MTBF" value={num(fleet.mtbfHours, 0)} unit="h" detail={fleet.mtbfHours.value === null ? fleet.mtbfHours.reason : `${fleet.breakdowns.breakdowns} breakdown(s)`} />
        <Tile label="MTTR" value={num(fleet.mttrMinutes, 0)} unit="min" detail={fleet.mttrMinutes.value === null ? fleet.mttrMinutes.reason : `${fleet.breakdowns.repaired} repaired`} />
        <Tile label="Availability" value={pct(fleet.availability)} unit="%" detail={`${Math.round(fleet.breakdowns.downtimeMinutesInPeriod)} min of breakdown downtime`} />
        <Tile testId="kpi-backlog" label="Backlog" value={String(fleet.backlog.total)} unit="orders" detail={BACKLOG_BUCKETS.map((b) => `${b} d: ${fleet.backlog[b]}`).join(" · ")} />
      </section>
      <section aria-label="Per oven" className="card mt-5 overflow-x-auto" tabIndex={0}>
        <table className="w-full min-w-[640px] text-left text-sm">
          <thead className="border-b border-paper-line bg-paper-sunk/60 text-xs uppercase tracking-wide text-ink-muted">
            <tr><th className="px-3 py-2">Oven</th><th className="px-3 py-2">PM compliance</th><th className="px-3 py-2">MTBF</th><th className="px-3 py-2">MTTR</th><th className="px-3 py-2">Availability</th><th className="px-3 py-2">Backlog</th></tr>
          </thead>
          <tbody>
            {perOven.map((k) => (
              <tr key={k.ovenId} className="border-b border-paper-line last:border-0">
                <th scope="row" className="px-3 py-2 font-semibold">{k.tag}</th>
                <td className="px-3 py-2"><span className="num">{pct(k.pmCompliance)}</span>{k.pmCompliance.value !== null ? <span className="unit">%</span> : null} <span className="text-xs text-ink-muted">({k.pmCompliance.doneOnTime}/{k.pmCompliance.due})</span></td>
                <td className="px-3 py-2"><span className="num">{num(k.mtbfHours)}</span>{k.mtbfHours.value !== null ? <span className="unit">h</span> : null}</td>
                <td className="px-3 py-2"><span className="num">{num(k.mttrMinutes)}</span>{k.mttrMinutes.value !== null ? <span className="unit">min</span> : null}</td>
                <td className="px-3 py-2"><span className="num">{pct(k.availability)}</span><span className="unit">%</span></td>
                <td className="px-3 py-2 num">{k.backlog.total}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <section aria-label="Definitions" className="mt-6 max-w-prose space-y-2 text-sm text-ink-soft">
        <h2 className="text-base font-semibold text-ink">How these are counted</h2>
        {Object.entries(KPI_DEFINITIONS).map(([k, text]) => <p key={k}>{text}</p>)}
      </section>
    </>
  );
}
