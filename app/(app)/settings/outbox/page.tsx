import Link from "next/link";
import { getDb } from "@/db";
import { listOutbox } from "@/db/queries/outbox";
import { OUTBOX_STATES, type OutboxState } from "@/db/schema/mail";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { requirePermission } from "@/lib/session";
import { formatAgo } from "@/lib/format";
import { MAIL_KIND_INFO, type MailKindName } from "@/lib/mail/kinds";
import { ResendForm } from "./resend-form";

export const metadata = { title: "Outbox" };
export const dynamic = "force-dynamic";

const STATE_WORDS: Record<OutboxState, { word: string; cls: string }> = {
  pending: { word: "Waiting", cls: "border-paper-line text-ink-soft" },
  sending: { word: "Sending", cls: "border-amber-400 text-amber-800" },
  sent: { word: "Sent", cls: "border-health-steady/40 text-health-steady" },
  failed: { word: "Refused", cls: "border-health-act/40 text-health-act" },
  dead: { word: "Gave up", cls: "border-health-act/40 text-health-act" },
};

export default async function OutboxPage({ searchParams }: { searchParams: Promise<{ state?: string }> }) {
  await requirePermission("outbox.manage");
  const raw = (await searchParams).state;
  const state = (OUTBOX_STATES as readonly string[]).includes(raw ?? "") ? (raw as OutboxState) : undefined;
  const rows = await listOutbox(await getDb(), { state });
  return (
    <>
      <PageHeader
        title="Outbox"
        subtitle="Every e-mail Ovenward sends on its own, newest first. Failed tries are retried after 1, 2, 4 … minutes (at most an hour apart); after 8 tries it gives up and keeps the error."
      />
      <nav aria-label="Filter by state" className="mb-4 flex flex-wrap gap-2">
        {[undefined, ...OUTBOX_STATES].map((s) => (
          <Link
            key={s ?? "all"}
            href={s ? `/settings/outbox?state=${s}` : "/settings/outbox"}
            aria-current={s === state ? "page" : undefined}
            className={`inline-flex min-h-11 items-center rounded-lg border px-3 text-sm ${s === state ? "border-ember bg-ember-soft font-semibold text-ember-strong" : "border-paper-line bg-paper-raised"}`}
          >
            {s ? STATE_WORDS[s].word : "All"}
          </Link>
        ))}
      </nav>
      {rows.length === 0 ? (
        <EmptyState title="Nothing here">Digests, morning lists and alerts appear here as soon as a tick queues them.</EmptyState>
      ) : (
        <ul className="grid gap-2">
          {rows.map((r) => (
            <li key={r.id} className="card flex flex-wrap items-start justify-between gap-3 p-4" data-testid="outbox-row">
              <div className="min-w-0 flex-1">
                <p className="font-medium">{r.subject}</p>
                <p className="text-sm text-ink-muted">
                  {MAIL_KIND_INFO[r.kind as MailKindName]?.label ?? r.kind} · to {r.to} · queued {formatAgo(r.createdAt)}
                  {r.sentAt ? ` · sent ${formatAgo(r.sentAt)}` : ""} · <span className="num">{r.attempts}</span> {r.attempts === 1 ? "try" : "tries"}
                </p>
                {r.lastError ? <p className="mt-1 break-words text-sm text-health-act">Last error: {r.lastError}</p> : null}
                {r.smtpResponse && r.state === "sent" ? <p className="mt-1 break-all font-mono text-xs text-ink-muted">{r.smtpResponse}</p> : null}
              </div>
              <div className="flex items-center gap-3">
                <span className={`rounded-md border bg-paper-raised px-2 py-0.5 text-xs font-semibold ${STATE_WORDS[r.state].cls}`}>{STATE_WORDS[r.state].word}</span>
                {r.state !== "sending" ? <ResendForm id={r.id} subject={r.subject} /> : null}
              </div>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
