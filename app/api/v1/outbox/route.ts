import { withApi, parseQuery } from "@/lib/api";
import { listOutbox } from "@/db/queries/outbox";
import { outboxQuerySchema } from "@/lib/validation/mail";

export type OutboxResponse = {
  items: { id: number; kind: string; to: string; subject: string; state: string; attempts: number; lastError: string | null; sentAt: string | null }[];
};

export const GET = withApi(
  async ({ req, db }): Promise<OutboxResponse> => {
    const { state } = parseQuery(req, outboxQuerySchema);
    const rows = await listOutbox(db, { state });
    return { items: rows.map((r) => ({ id: r.id, kind: r.kind, to: r.to, subject: r.subject, state: r.state, attempts: r.attempts, lastError: r.lastError, sentAt: r.sentAt ? r.sentAt.toISOString() : null })) };
  },
  { permission: "outbox.manage", what: "see the outbox" },
);
