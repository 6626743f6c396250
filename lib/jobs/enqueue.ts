import "server-only";
import { renderMail } from "@/lib/mail-render";
import type { Db } from "@/db/client";
import { enqueueOutbox } from "@/db/queries/outbox";
import { markOccurrenceEnqueued } from "@/db/queries/subscriptions";
import { eventKey, messageIdFor, scheduledKey } from "@/lib/mail/outbox-policy";
import { signUnsubscribeToken, UNSUBSCRIBE_TOKEN_DAYS } from "@/lib/mail-token";
import { appUrl } from "@/lib/env";
import { MAIL_KIND_REGISTRY, type Due, type MailKindDef } from "./mail-kinds";

const DAY_MS = 86_400_000;

/** The settings and signed unsubscribe links, and the RFC 8058 one-click headers that go with them. */
export function linksFor(userId: string, kind: string, now: Date) {
  const token = signUnsubscribeToken({ userId, kind, expiresAt: new Date(now.getTime() + UNSUBSCRIBE_TOKEN_DAYS * DAY_MS) });
  const unsubscribe = `${appUrl()}/unsubscribe?token=${encodeURIComponent(token)}`;
  return {
    links: { settings: `${appUrl()}/settings/notifications`, unsubscribe },
    headers: { "List-Unsubscribe": `<${unsubscribe}>`, "List-Unsubscribe-Post": "List-Unsubscribe=One-Click" },
  };
}

async function enqueueOne<P>(db: Db, def: MailKindDef<P>, due: Due<P>, now: Date): Promise<boolean> {
  const key = due.occurrence ? scheduledKey(def.kind, due.recipient.id, due.occurrence) : eventKey(def.kind, due.recipient.id, due.event ?? "");
  const { links, headers } = linksFor(due.recipient.id, def.kind, now);
  const { subject, element } = def.render({ ...due.props, links } as P);
  const { html, text } = await renderMail(element);
  // The queue row and the subscription's high-water mark move together: a crash between two
  // messages leaves each either fully queued or not queued (and then found due again).
  return db.transaction(async (tx) => {
    const queued = await enqueueOutbox(tx, {
      kind: def.kind,
      recipientUserId: due.recipient.id,
      to: due.recipient.email,
      subject,
      html,
      text,
      headers: { ...headers, "Message-ID": messageIdFor(key) },
      idempotencyKey: key,
      state: "pending",
      nextAttemptAt: now,
      createdAt: now,
    });
    if (due.subscriptionId && due.occurrence) await markOccurrenceEnqueued(tx, due.subscriptionId, due.occurrence);
    return queued;
  });
}

/** Every kind's due messages into the outbox. Returns how many rows were new. */
export async function enqueueDue(db: Db, now: Date, kinds = MAIL_KIND_REGISTRY): Promise<number> {
  let enqueued = 0;
  for (const def of kinds) {
    for (const due of await def.collect(db, now)) {
      if (await enqueueOne(db, def, due, now)) enqueued++;
    }
  }
  return enqueued;
}
