import Link from "next/link";
import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { changeImpact } from "@/db/queries/impact";
import { getOven } from "@/db/queries/ovens";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { impactQuerySchema } from "@/lib/validation/drift";
import { METRIC_INFO, TRACKED_METRICS } from "@/lib/tracked-metrics";
import { CHANGE_AREA_LABELS } from "@/lib/validation/change";
import { formatDateTime } from "@/lib/format";
import { AppError } from "@/lib/errors";

export const metadata = { title: "Change impact" };

const n = (v: number | null, d: number) => (v == null ? "—" : v.toFixed(d));

export default async function ChangeImpactPage({ params, searchParams }: { params: Promise<{ changeId: string }>; searchParams: Promise<Record<string, string>> }) {
  await requirePermission("change.read");
  const id = Number((await params).changeId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const raw = await searchParams;
  const q = impactQuerySchema.safeParse(raw);
  const opts = q.success ? q.data : impactQuerySchema.parse({});
  const db = await getDb();
  let impact;
  try {
    impact = await changeImpact(db, id, opts.metric, { before: opts.before, after: opts.after, delta: opts.delta });
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
  const oven = (await getOven(db, impact.change.ovenId))!;
  const info = METRIC_INFO[impact.metric];
  const d = info.decimals + 1;
  const select = "min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 text-sm";
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/ovens/${oven.oven.id}/changes`} className="underline">
          {oven.oven.tag} changes
        </Link>
      </nav>
      <PageHeader
        title={`Change impact: ${impact.change.summary}`}
        subtitle={`${CHANGE_AREA_LABELS[impact.change.area as keyof typeof CHANGE_AREA_LABELS]} · ${impact.change.before ? `${impact.change.before} → ` : ""}${impact.change.after} · ${formatDateTime(new Date(impact.change.at), oven.site.timeZone)}`}
      />
      <form method="get" className="mb-4 flex flex-wrap items-end gap-3" aria-label="Compare">
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Metric
          <select name="metric" defaultValue={impact.metric} className={select}>
            {TRACKED_METRICS.map((m) => (
              <option key={m} value={m}>
                {METRIC_INFO[m].label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Runs before
          <input name="before" type="number" min={2} max={200} defaultValue={opts.before} className={select} />
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Runs after
          <input name="after" type="number" min={2} max={200} defaultValue={opts.after} className={select} />
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Difference to detect ({info.unit})
          <input name="delta" type="number" step="any" min={0} defaultValue={impact.runsNeeded?.delta ?? ""} className={select} />
        </label>
        <button className={buttonClass("secondary")}>Compare</button>
      </form>
      <section className="card space-y-3 p-5" aria-labelledby="impact-summary">
        <h2 id="impact-summary" className="sr-only">
          Summary
        </h2>
        <p className="text-lg">{impact.summary}</p>
        {impact.runsNeeded ? (
          <p className="text-sm text-ink-soft">
            To see a difference of {impact.runsNeeded.delta} {info.unit} with this scatter, plan about <strong className="num">{impact.runsNeeded.nPerGroup}</strong> runs before and after (two-sided test at 5 %, power 80 %).
          </p>
        ) : null}
        <dl className="grid gap-3 text-sm sm:grid-cols-4">
          <div>
            <dt className="text-ink-muted">Before</dt>
            <dd className="num">
              {n(impact.before.mean, d)} <span className="unit">{info.unit}</span> (sd {n(impact.before.sd, d)}, n {impact.before.n})
            </dd>
          </div>
          <div>
            <dt className="text-ink-muted">After</dt>
            <dd className="num">
              {n(impact.after.mean, d)} <span className="unit">{info.unit}</span> (sd {n(impact.after.sd, d)}, n {impact.after.n})
            </dd>
          </div>
          <div>
            <dt className="text-ink-muted">Difference, 95 % interval</dt>
            <dd className="num">
              {n(impact.difference, d)} [{n(impact.interval?.[0] ?? null, d)}, {n(impact.interval?.[1] ?? null, d)}] <span className="unit">{info.unit}</span>
            </dd>
          </div>
          <div>
            <dt className="text-ink-muted">Measurement uncertainty (k = 2)</dt>
            <dd className="num">{impact.expandedUncertainty == null ? "not assessed" : `±${n(impact.expandedUncertainty, d)} ${info.unit}`}</dd>
          </div>
        </dl>
        <p className="text-xs text-ink-muted">
          Welch&apos;s t-test: t = <span className="num">{n(impact.t, 3)}</span>, df = <span className="num">{n(impact.df, 1)}</span>, p ={" "}
          <span className="num">{impact.p == null ? "—" : impact.p < 1e-4 ? impact.p.toExponential(2) : impact.p.toFixed(4)}</span>.{" "}
          {impact.uncertaintyComponents.length ? `Uncertainty from ${impact.uncertaintyComponents.map((c) => `${c.label} (u = ${c.u.toFixed(3)})`).join(", ")}.` : ""}
        </p>
      </section>
    </>
  );
}
