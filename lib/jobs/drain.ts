import "server-only";
import { randomUUID } from "node:crypto";
import type { Db } from "@/db/client";
import { claimOutbox, markOutboxFailed, markOutboxSent } from "@/db/queries/outbox";
import { afterFailure } from "@/lib/mail/outbox-policy";

/*
 * Drains the outbox. Why a crash never skips a message and never sends one twice from the queue:
 *  - A row is claimed (state=sending, a fresh lease token, claimedAt) in one UPDATE, so two
 *    drains can never hold the same row.
 *  - A drain that dies after claiming leaves the row in `sending`; once it is older than
 *    SENDING_TIMEOUT_MS it is claimed again — it is never lost. The timeout is far longer than
 *    nodemailer's own connection and socket timeouts, so a live but slow drain keeps its rows.
 *  - Only the holder of the lease token may mark the row sent or failed.
 * What remains is at-least-once, not exactly-once, in one narrow window: the SMTP server has
 * accepted the message but the drain dies before its UPDATE to `sent` is written. The SMTP
 * accept and the database write cannot be one atomic step. The row is then sent again after the
 * timeout — with the same Message-ID (derived from the idempotency key), so a receiving server
 * or client that deduplicates by Message-ID drops the copy.
 */

export const SENDING_TIMEOUT_MS = 10 * 60_000;
// (lib/mail.ts's SMTP_TIMEOUTS keep every send far shorter than this.)
const BATCH = 25;

/** The part of a nodemailer Transporter the drain uses. */
export type MailTransport = { sendMail: (mail: Record<string, unknown>) => Promise<{ response?: string; messageId?: string }> };

type SmtpError = Error & { responseCode?: number; response?: string; code?: string };

export async function drainOutbox(
  db: Db,
  { now, transport, from, limit = 200, keepGoing }: { now: Date; transport: MailTransport; from: string; limit?: number; keepGoing?: () => Promise<boolean> },
) {
  let sent = 0;
  let failed = 0;
  const staleBefore = new Date(now.getTime() - SENDING_TIMEOUT_MS);
  while (sent + failed < limit) {
    // The tick renews its lease before each batch and stops if another instance took it over.
    if (keepGoing && !(await keepGoing())) break;
    const leaseToken = randomUUID();
    const rows = await claimOutbox(db, { now, leaseToken, staleBefore, limit: Math.min(BATCH, limit - sent - failed) });
    if (rows.length === 0) break;
    for (const row of rows) {
      const { "Message-ID": messageId, ...headers } = row.headers;
      try {
        const info = await transport.sendMail({ from, to: row.to, subject: row.subject, html: row.html, text: row.text, headers, messageId });
        await markOutboxSent(db, row.id, leaseToken, now, info.response ?? "accepted");
        sent++;
      } catch (err) {
        const e = err as SmtpError;
        // A 5xx reply means this server will never take this message (e.g. no such mailbox):
        // retrying cannot help, so it waits for an admin. Anything else is retried with backoff.
        const permanent = typeof e.responseCode === "number" && e.responseCode >= 500;
        const outcome = permanent ? { state: "failed" as const, nextAttemptAt: now } : afterFailure(row.attempts, now);
        await markOutboxFailed(db, row.id, leaseToken, { ...outcome, error: `${e.code ? `${e.code}: ` : ""}${e.message}`.slice(0, 1000), smtpResponse: e.response ?? null });
        failed++;
      }
    }
  }
  return { sent, failed };
}
