import "server-only";
import os from "node:os";
import nodemailer from "nodemailer";
import type { Db } from "@/db/client";
import { runTick, type TickResult } from "./tick";
import { SMTP_TIMEOUTS } from "@/lib/mail";

export const TICK_INTERVAL_MS = 60_000;

/**
 * The in-process scheduler: one tick at start, then one a minute. Started by scripts/serve.mts
 * (the process that runs the app), not by Next itself, so `next dev` and builds never send mail
 * on their own. Several app instances may each run it: the lease lets one tick at a time.
 */
export function startSchedulerTimer({ db, smtpUrl, from, log = console.log }: { db: Db; smtpUrl: string; from: string; log?: (line: string) => void }) {
  const transport = nodemailer.createTransport({ url: smtpUrl, ...SMTP_TIMEOUTS });
  const holder = `${os.hostname()}:${process.pid}`;
  let running = false;
  const tick = async (): Promise<TickResult | null> => {
    if (running) return null; // a slow tick is never overlapped by this process's next one
    running = true;
    try {
      const r = await runTick({ db, now: new Date(), transport, from, holder });
      if (r.enqueued || r.sent || r.failed || r.generated) log(`[scheduler] enqueued ${r.enqueued}, sent ${r.sent}, failed ${r.failed}, generated ${r.generated}`);
      return r;
    } catch (err) {
      log(`[scheduler] tick failed: ${(err as Error).message}`);
      return null;
    } finally {
      running = false;
    }
  };
  const first = tick();
  const timer = setInterval(tick, TICK_INTERVAL_MS);
  return {
    first,
    stop: () => {
      clearInterval(timer);
      transport.close();
    },
  };
}
