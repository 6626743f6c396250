import Link from "next/link";
import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { getOven } from "@/db/queries/ovens";
import { getRunDetail, getRunSeries } from "@/db/queries/runs";
import { listWindows } from "@/db/queries/windows";
import { BoardMap } from "@/components/runs/board-map";
import { ProfileChart } from "@/components/runs/profile-chart";
import { VerdictBadge, verdictLabel } from "@/components/runs/verdict-badge";
import { SafetyNote } from "@/components/oven/safety-note";
import { buttonClass } from "@/components/ui/button";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { formatDateTime } from "@/lib/format";
import { phasesOf, thinSeries } from "@/lib/runs/chart-data";
import { fmt } from "@/lib/runs/format";
import { ProbeTable } from "./probe-table";
import { RunSidePanel } from "./side-panel";
import { WindowUseBars } from "./window-use-bars";
import { DeleteRunForm, RejudgeForm } from "./run-actions";
import { PrintButton } from "./print-button";

export const metadata = { title: "Run" };

function Tile({ label, value, unit }: { label: string; value: string; unit: string }) {
  return (
    <div className="rounded-lg border border-paper-line bg-paper-raised px-3 py-2">
      <p className="text-xs text-ink-muted">{label}</p>
      <p className="text-lg font-semibold"><span className="num">{value}</span> <span className="unit text-sm">{unit}</span></p>
    </div>
  );
}

export default async function RunPage({ params }: { params: Promise<{ runId: string }> }) {
  const actor = await requirePermission("run.read");
  const id = Number((await params).runId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const db = await getDb();
  const d = await getRunDetail(db, id);
  if (!d) notFound();
  const [oven, stored, windows] = await Promise.all([getOven(db, d.run.ovenId), getRunSeries(db, id), can(actor.role, "run.rejudge") ? listWindows(db) : Promise.resolve([])]);
  const tz = oven?.site.timeZone ?? "UTC";
  const r = d.run;
  const w = r.windowValues;
  const thin = stored ? thinSeries(stored.time, stored.channels) : null;
  const series = thin ? { time: thin.time, probes: d.channels.map((c, i) => ({ key: `p${i}`, label: c.probeLabel, values: thin.channels[i] })) } : null;
  const phases = stored ? phasesOf(stored.time, stored.channels, w) : null;
  const sitsOn = Object.fromEntries((d.board?.probes ?? []).map((p) => [p.label, p.sitsOn]));
  const boardProbes = (d.board?.probes ?? []).map((p) => {
    const index = d.channels.findIndex((c) => c.probeLabel === p.label);
    return { ...p, peak: index >= 0 ? d.channels[index].peak : null, index: Math.max(0, index) };
  });
  const windowName = d.windowName ?? "SAC305 paste, typical window (built-in)";
  const newer = r.windowVersion !== null && d.currentWindowVersion !== null && d.currentWindowVersion > r.windowVersion;
  return (
    <article className="space-y-6">
      <nav aria-label="Breadcrumb" className="no-print text-sm text-ink-muted">
        <Link href="/runs" className="underline">Runs</Link> / <Link href={`/ovens/${r.ovenId}/runs`} className="underline">{d.oven.tag}</Link>
      </nav>
      <header className={`card flex flex-wrap items-center justify-between gap-4 border-l-4 p-4 ${r.verdictStatus === "pass" ? "border-l-health-steady" : r.verdictStatus === "marginal" ? "border-l-health-watch" : "border-l-health-act"}`}>
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold tracking-tight">
            {d.oven.tag} run, <span className="num">{formatDateTime(r.runAt, tz)}</span>
          </h1>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
            <VerdictBadge status={r.verdictStatus} windowUse={r.windowUse} />
            <span>
              {verdictLabel(r.verdictStatus)}: the worst statistic uses <span className="num">{fmt(r.windowUse, 0)}</span> % of {windowName}
              {r.windowVersion ? ` (version ${r.windowVersion})` : ""}.
            </span>
          </p>
          {newer ? <p className="text-xs text-ink-muted">The window has been edited since (now version {d.currentWindowVersion}); this verdict keeps the values it was judged with.</p> : null}
        </div>
        <div className="no-print flex flex-wrap gap-2">
          {r.fileSha256 ? <a href={`/api/v1/runs/${r.id}/file`} className={buttonClass("secondary")}>Download original file</a> : null}
          <PrintButton />
        </div>
      </header>

      <section className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6" aria-label="Board metrics">
        <Tile label="ΔT at peak" value={fmt(r.deltaTPeak)} unit="°C" />
        <Tile label="Peak, coldest–hottest" value={`${fmt(r.peakMin)}–${fmt(r.peakMax)}`} unit="°C" />
        <Tile label="Critical spread" value={fmt(r.criticalSpread)} unit="°C" />
        <Tile label="TAL, shortest" value={fmt(r.talMin, 0)} unit="s" />
        <Tile label="Heat-up, slowest" value={fmt(r.heatUpRate, 2)} unit="°C/s" />
        <Tile label="25 °C → peak" value={fmt(r.timeToPeakMax, 0)} unit="s" />
      </section>

      <div className="grid gap-6 lg:grid-cols-[1fr_20rem] print:block">
        <div className="min-w-0 space-y-6">
          <section className="card p-4" aria-labelledby="profile-heading">
            <h2 id="profile-heading" className="mb-2 font-semibold">Profile</h2>
            {series ? <ProfileChart series={series} bands={w} phases={phases} /> : <p className="text-sm text-ink-muted">The curves of this run were not stored.</p>}
          </section>
          <div className="grid gap-6 md:grid-cols-2">
            <section className="card p-4" aria-labelledby="map-heading">
              <h2 id="map-heading" className="mb-2 font-semibold">Board map</h2>
              {d.board ? <BoardMap name={d.board.name} widthMm={d.board.widthMm} heightMm={d.board.heightMm} probes={boardProbes} /> : <p className="text-sm text-ink-muted">No test board was recorded for this run, so probe positions are unknown.</p>}
            </section>
            <section className="card p-4" aria-labelledby="use-heading">
              <h2 id="use-heading" className="mb-2 font-semibold">Window use</h2>
              <WindowUseBars items={r.verdictItems} />
              <p className="mt-3 text-xs text-ink-muted">Up to 90 % is in window; 90–100 % is near the edge; over 100 % is out. The line marks 90 %.</p>
            </section>
          </div>
        </div>
        <div className="space-y-4">
          <RunSidePanel d={d} timeZone={tz} />
          {can(actor.role, "run.rejudge") ? (
            <section className="card no-print space-y-3 p-4">
              <h2 className="font-semibold">Re-judge</h2>
              <p className="text-xs text-ink-muted">Judges the stored curves against a window&apos;s current version. Both verdicts are kept.</p>
              <RejudgeForm runId={r.id} windows={windows.map((x) => ({ id: x.id, name: x.name, version: x.version }))} currentWindowId={r.windowId} />
            </section>
          ) : null}
          {can(actor.role, "run.delete") ? (
            <section className="card no-print p-4">
              <DeleteRunForm runId={r.id} ovenId={r.ovenId} />
            </section>
          ) : null}
        </div>
      </div>
      <section className="card p-4" aria-labelledby="probes-heading">
        <h2 id="probes-heading" className="mb-2 font-semibold">Per probe</h2>
        <ProbeTable channels={d.channels} sitsOn={sitsOn} />
        {r.warnings.length ? (
          <ul className="mt-3 list-disc space-y-1 pl-5 text-xs text-ink-muted">{r.warnings.map((x) => <li key={x}>{x}</li>)}</ul>
        ) : null}
      </section>
      {d.judgements.length ? (
        <section className="card p-4" aria-labelledby="judgements-heading">
          <h2 id="judgements-heading" className="mb-2 font-semibold">Re-judged</h2>
          <ul className="space-y-2 text-sm">
            {d.judgements.map((j) => (
              <li key={j.id} className="flex flex-wrap items-center gap-2">
                <VerdictBadge status={j.verdictStatus} windowUse={j.windowUse} />
                <span className="text-ink-soft">against window version {j.windowVersion ?? "built-in"}, {formatDateTime(j.createdAt, tz)}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <SafetyNote kind="verdicts" />
    </article>
  );
}
