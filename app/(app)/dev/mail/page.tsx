import { notFound } from "next/navigation";
import { getDb } from "@/db";
import { latestSinkMessages } from "@/lib/mail-sink";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { requirePermission } from "@/lib/session";
import { env } from "@/lib/env";
import { formatAgo } from "@/lib/format";

export const metadata = { title: "Captured mail" };
export const dynamic = "force-dynamic";

// Development only: what the local SMTP sink received. Absent when the sink is off.
export default async function CapturedMail() {
  if (env().SMTP_SINK !== "on") notFound();
  await requirePermission("mail.sink.read");
  const messages = await latestSinkMessages(await getDb(), 100);
  return (
    <>
      <PageHeader title="Captured mail" subtitle="Every message the local SMTP sink received, newest first. Nothing here left this machine." />
      {messages.length === 0 ? (
        <EmptyState title="No messages yet">Invitations and sign-in links land here while the sink is on.</EmptyState>
      ) : (
        <ul className="grid gap-3">
          {messages.map((m) => (
            <li key={m.id} className="card p-4">
              <details>
                <summary className="cursor-pointer">
                  <span className="font-medium">{m.subject ?? "(no subject)"}</span>
                  <span className="block text-sm text-ink-muted">
                    to {m.envelopeTo} · {formatAgo(m.receivedAt)}
                  </span>
                </summary>
                <pre className="mt-3 max-h-80 overflow-auto whitespace-pre-wrap rounded bg-paper-sunk p-3 text-sm">{m.text}</pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
