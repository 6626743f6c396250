import Link from "next/link";
import { getDb } from "@/db";
import { listOvens } from "@/db/queries/ovens";
import { loadCalendar } from "@/db/queries/maintenance-calendar";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { localDateKey, wallMsToInstant } from "@/lib/maintenance/wall-time";
import { STATE_LABELS } from "@/lib/maintenance/work-order-state";

export const metadata = { title: "Calendar" };
export const dynamic = "force-dynamic";

const DAY = 86_400_000;
const WEEKDAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
const dateMs = (d: string) => Date.parse(`${d}T00:00:00Z`);
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);
/** Monday on or before a local date (dates handled as UTC midnights, so no zone math). */
const mondayOf = (d: string) => dateMs(d) - ((new Date(dateMs(d)).getUTCDay() + 6) % 7) * DAY;

export default async function CalendarPage({ searchParams }: { searchParams: Promise<{ view?: string; start?: string; ovenId?: string }> }) {
  await requirePermission("maintenance.read");
  const sp = await searchParams;
  const db = await getDb();
  const ovens = await listOvens(db);
  const tz = ovens[0]?.site.timeZone ?? "UTC";
  const now = new Date();
  const view = sp.view === "week" ? "week" : "month";
  const anchor = sp.start && /^\d{4}-\d{2}-\d{2}$/.test(sp.start) ? sp.start : localDateKey(now, tz);
  const monthStart = `${anchor.slice(0, 8)}01`;
  const firstDay = view === "week" ? mondayOf(anchor) : mondayOf(monthStart);
  const monthEnd = Date.UTC(Number(anchor.slice(0, 4)), Number(anchor.slice(5, 7)), 1);
  const lastDay = view === "week" ? firstDay + 7 * DAY : mondayOf(iso(monthEnd - DAY)) + 7 * DAY;
  const ovenId = sp.ovenId ? Number(sp.ovenId) || undefined : undefined;
  const from = wallMsToInstant(firstDay, tz).instant;
  const to = wallMsToInstant(lastDay, tz).instant;
  const { days, tags } = await loadCalendar(db, { from, to, now, timeZone: tz, ovenId });
  const step = view === "week" ? iso(firstDay + 7 * DAY) : iso(monthEnd);
  const back = view === "week" ? iso(firstDay - 7 * DAY) : iso(Date.UTC(Number(anchor.slice(0, 4)), Number(anchor.slice(5, 7)) - 2, 1));
  const q = (patch: Record<string, string>) => `/calendar?${new URLSearchParams({ view, start: anchor, ...(ovenId ? { ovenId: String(ovenId) } : {}), ...patch })}`;
  const title = view === "week" ? `Week of ${iso(firstDay)}` : new Intl.DateTimeFormat("en-GB", { month: "long", year: "numeric", timeZone: "UTC" }).format(new Date(dateMs(monthStart)));
  const today = localDateKey(now, tz);
  return (
    <>
      <PageHeader title="Calendar" subtitle={`Work orders that exist (solid) and occurrences still to be generated (dashed, forecast), in ${tz} time.`} />
      <div className="mb-4 flex flex-wrap items-center gap-2">
        <Link href={q({ start: back })} className={buttonClass("secondary")} aria-label="Earlier">←</Link>
        <h2 className="min-w-40 text-center text-lg font-semibold">{title}</h2>
        <Link href={q({ start: step })} className={buttonClass("secondary")} aria-label="Later">→</Link>
        <Link href={q({ view: "month" })} aria-current={view === "month" ? "page" : undefined} className={buttonClass(view === "month" ? "primary" : "secondary")}>Month</Link>
        <Link href={q({ view: "week" })} aria-current={view === "week" ? "page" : undefined} className={buttonClass(view === "week" ? "primary" : "secondary")}>Week</Link>
        <form method="get" className="flex items-center gap-2">
          <input type="hidden" name="view" value={view} /><input type="hidden" name="start" value={anchor} />
          <select name="ovenId" defaultValue={ovenId ?? ""} aria-label="Oven" className="min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2 text-sm">
            <option value="">All ovens</option>
            {ovens.map((o) => <option key={o.oven.id} value={o.oven.id}>{o.oven.tag}</option>)}
          </select>
          <button className={buttonClass("secondary")}>Show</button>
        </form>
      </div>
      <div className="hidden grid-cols-7 gap-1 text-xs font-semibold uppercase tracking-wide text-ink-muted md:grid">{WEEKDAYS.map((d) => <div key={d} className="px-1">{d}</div>)}</div>
      <ol className="grid grid-cols-1 gap-1 md:grid-cols-7">
        {days.map((d) => {
          const outside = view === "month" && d.date.slice(0, 7) !== anchor.slice(0, 7);
          const count = d.planned.length + d.forecast.length;
          const cap = view === "week" ? 50 : 6;
          const hidden = count - Math.min(d.planned.length, cap) - Math.min(d.forecast.length, cap);
          if (outside && count === 0) return <li key={d.date} className="hidden md:block" aria-hidden="true" />;
          return (
            <li key={d.date} className={`card min-h-24 p-1.5 ${outside ? "bg-paper-sunk" : ""} ${d.date === today ? "border-ember" : ""} ${count === 0 ? "hidden md:block" : ""}`}>
              <p className="mb-1 text-xs font-semibold text-ink-soft"><span className="md:hidden">{WEEKDAYS[(new Date(dateMs(d.date)).getUTCDay() + 6) % 7]} </span><span className="num">{d.date.slice(8)}</span>{d.date === today ? " · today" : ""}</p>
              <ul className="space-y-1">
                {d.planned.slice(0, cap).map((e) => (
                  <li key={`p${e.orderId}`}>
                    <Link href={`/work-orders/${e.orderId}`} className={`block rounded border px-1 py-0.5 text-xs leading-tight ${e.state === "done" ? "border-health-steady/40 text-ink-soft line-through decoration-health-steady" : "border-ink-faint/50 bg-paper-raised"}`} title={`${e.localTime} ${e.title} (${STATE_LABELS[e.state]})`}>
                      <span className="num">{e.localTime}</span> {tags.get(e.ovenId ?? "") ?? ""} · {e.title}
                    </Link>
                  </li>
                ))}
                {d.forecast.slice(0, cap).map((e) => (
                  <li key={`f${e.occurrenceKey}`} className="rounded border border-dashed border-ink-faint/60 px-1 py-0.5 text-xs leading-tight text-ink-soft" title="Forecast: not generated yet">
                    <span className="num">{e.localTime}</span> {tags.get(e.ovenId ?? "") ?? ""} · {e.title} <span className="text-ink-muted">(forecast)</span>
                  </li>
                ))}
                {hidden > 0 ? <li className="text-xs text-ink-muted">+{hidden} more — <Link className="underline" href={q({ view: "week", start: d.date })}>see the week</Link></li> : null}
              </ul>
            </li>
          );
        })}
      </ol>
    </>
  );
}
