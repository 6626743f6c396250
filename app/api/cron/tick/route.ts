import { withCronSecret } from "@/lib/cron";
import { runTick } from "@/lib/jobs/tick";
import { mailTransport } from "@/lib/mail";
import { env } from "@/lib/env";

export const dynamic = "force-dynamic";

// For an external cron (e.g. every minute). Safe to call as often as you like: the lease lets
// one tick run at a time and the outbox keys make repeats harmless.
// A tick that found the lease held answers `skipped: "lease_held"`; one that ran says when it held it.
export const POST = withCronSecret(async ({ db, now }) => {
  const { enqueued, sent, failed, generated, skipped, startedAt, finishedAt } = await runTick({ db, now, transport: mailTransport(), from: env().MAIL_FROM });
  return { enqueued, sent, failed, generated, ...(skipped ? { skipped } : { startedAt: startedAt?.toISOString(), finishedAt: finishedAt?.toISOString() }) };
});
