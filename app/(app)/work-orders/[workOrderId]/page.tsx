import Link from "next/link";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { formatDateTime } from "@/lib/format";
import { KIND_LABELS, nextStates } from "@/lib/maintenance/work-order-state";
import { WorkOrderStateBadge, isOverdue } from "@/components/maintenance/state-badge";
import { WorkOrderCautions } from "@/components/maintenance/work-order-cautions";
import { buttonClass } from "@/components/ui/button";
import { loadWorkOrderPage } from "./load";
import { StateButtons, CommentForm } from "./order-controls";

export const metadata = { title: "Work order" };
export const dynamic = "force-dynamic";

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex justify-between gap-4 border-b border-paper-line py-2 text-sm last:border-0">
      <dt className="text-ink-muted">{label}</dt>
      <dd className="text-right text-ink">{children}</dd>
    </div>
  );
}

export default async function WorkOrderPage({ params, searchParams }: { params: Promise<{ workOrderId: string }>; searchParams: Promise<{ closed?: string }> }) {
  const actor = await requirePermission("maintenance.read");
  const { order: o, oven, parts, attachments, comments } = await loadWorkOrderPage((await params).workOrderId);
  const tz = oven.site.timeZone;
  const now = new Date();
  const canWork = can(actor.role, "workorder.update");
  const when = (d: Date | null) => (d ? formatDateTime(d, tz) : "—");
  return (
    <div className="mx-auto max-w-3xl space-y-5">
      <nav aria-label="Breadcrumb" className="text-sm text-ink-muted">
        <Link href="/work-orders" className="underline">Work orders</Link> / {o.number}
      </nav>
      {(await searchParams).closed ? <p role="status" className="card border-health-steady/40 bg-teal-50 p-3 text-sm text-health-steady">{o.number} is closed. Thank you.</p> : null}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-sm font-semibold tracking-wide text-ink-soft">
            <Link href={`/ovens/${oven.oven.id}/maintenance`} className="underline">{oven.oven.tag}</Link> · {o.number} · {KIND_LABELS[o.kind]}
          </p>
          <h1 className="text-2xl font-semibold leading-snug tracking-tight">{o.title}</h1>
        </div>
        <WorkOrderStateBadge state={o.state} overdue={isOverdue(o, now)} />
      </header>
      <WorkOrderCautions lockout={o.safetyLockout} title={o.title} />
      {canWork && nextStates(o.state).length ? (
        <div className="flex flex-wrap gap-2">
          {nextStates(o.state).includes("done") || o.state === "on_hold" ? (
            <Link href={`/work-orders/${o.id}/close`} className={buttonClass("primary")}>Close…</Link>
          ) : null}
          <StateButtons id={o.id} version={o.version} targets={nextStates(o.state).filter((s) => s !== "done")} />
        </div>
      ) : null}
      <div className="grid gap-5 md:grid-cols-2">
        <dl className="card px-4 py-2">
          <Row label="Priority">{o.priority}</Row>
          <Row label="Due">{when(o.dueAt)}</Row>
          <Row label="Started">{when(o.startedAt)}</Row>
          <Row label="Completed">{when(o.completedAt)}</Row>
          <Row label="Labour"><span className="num">{o.labourMinutes ?? "—"}</span><span className="unit">min</span></Row>
          {o.breakdown || o.kind === "corrective" ? (
            <>
              <Row label="Breakdown">{o.breakdown ? `yes, from ${when(o.failureStartedAt)}` : "no"}</Row>
              <Row label="Downtime"><span className="num">{o.downtimeMinutes ?? "—"}</span><span className="unit">min</span></Row>
            </>
          ) : null}
          <Row label="Version"><span className="num">{o.version}</span></Row>
        </dl>
        <section className="card p-4" aria-label="Checklist results">
          <h2 className="mb-2 text-base font-semibold">Checklist</h2>
          {o.checklist.length === 0 ? <p className="text-sm text-ink-muted">No checklist.</p> : (
            <ul className="space-y-1 text-sm">
              {o.checklist.map((c) => {
                const r = o.checklistResults[c.id]?.ok;
                return (
                  <li key={c.id} className="flex justify-between gap-3">
                    <span>{c.label}{c.mandatory ? "" : " (optional)"}</span>
                    <span className={r === true ? "text-health-steady" : r === false ? "font-semibold text-health-act" : "text-ink-muted"}>{r === true ? "OK" : r === false ? "Not OK" : "—"}</span>
                  </li>
                );
              })}
            </ul>
          )}
        </section>
      </div>
      {o.notes ? <section className="card p-4"><h2 className="mb-1 text-base font-semibold">Notes</h2><p className="whitespace-pre-wrap text-sm">{o.notes}</p></section> : null}
      {parts.length ? (
        <section className="card p-4"><h2 className="mb-1 text-base font-semibold">Parts used</h2>
          <ul className="text-sm">{parts.map((p) => <li key={p.id}><span className="num">{p.quantity}</span> × {p.description}</li>)}</ul>
        </section>
      ) : null}
      {attachments.length ? (
        <section className="card p-4" aria-label="Photos and documents"><h2 className="mb-2 text-base font-semibold">Photos and documents</h2>
          <ul className="flex flex-wrap gap-3">
            {attachments.map((a) => (
              <li key={a.id}>
                <a href={`/api/v1/attachments/${a.id}`} className="block text-sm underline" target="_blank" rel="noreferrer">
                  {a.contentType.startsWith("image/") ? (
                    // eslint-disable-next-line @next/next/no-img-element -- served by our own route with the session
                    <img src={`/api/v1/attachments/${a.id}`} alt={a.fileName} className="h-24 w-24 rounded border border-paper-line object-cover" style={{ imageRendering: "pixelated" }} />
                  ) : a.fileName}
                </a>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section className="card p-4" aria-label="Comments">
        <h2 className="mb-2 text-base font-semibold">Comments</h2>
        <ul className="mb-3 space-y-2 text-sm">
          {comments.length === 0 ? <li className="text-ink-muted">No comments yet.</li> : comments.map(({ comment: c, authorName }) => (
            <li key={c.id}><span className="font-medium">{authorName ?? "Someone"}</span> <span className="text-ink-muted">· {formatDateTime(c.createdAt, tz)}</span><p className="whitespace-pre-wrap">{c.body}</p></li>
          ))}
        </ul>
        {canWork ? <CommentForm id={o.id} /> : null}
      </section>
    </div>
  );
}
