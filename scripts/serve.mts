// Starts the built app with its SMTP sink (when SMTP_SINK=on) on an embedded database.
// Used by `npm run demo` and by the end-to-end tests.
import { spawn } from "node:child_process";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { startMailSink } from "../lib/mail-sink";
import { env } from "../lib/env";
import { startSchedulerTimer } from "../lib/jobs/scheduler-timer";

const e = env();
const { db, client } = await openDatabase(e.DATABASE_URL, e.DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
let sink: Awaited<ReturnType<typeof startMailSink>> | null = null;
if (e.SMTP_SINK === "on") {
  sink = await startMailSink({ db, port: e.SMTP_SINK_PORT });
  console.log(`SMTP sink listening on 127.0.0.1:${e.SMTP_SINK_PORT}`);
}

// The scheduler (digests, reminders, outbox) ticks here, beside the app; SCHEDULER=off when an
// external cron calls POST /api/cron/tick instead.
const scheduler = e.SCHEDULER === "on" ? startSchedulerTimer({ db, smtpUrl: e.SMTP_URL, from: e.MAIL_FROM }) : null;
if (scheduler) console.log("Scheduler ticking every minute (SCHEDULER=off to leave it to an external cron)");

const child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(e.PORT)], {
  stdio: "inherit",
  env: { ...process.env, AUTH_TRUST_HOST: "true", AUTH_URL: process.env.AUTH_URL ?? `http://localhost:${e.PORT}` },
});

const stop = (signal: NodeJS.Signals) => {
  child.kill(signal);
};
process.on("SIGINT", () => stop("SIGINT"));
process.on("SIGTERM", () => stop("SIGTERM"));
child.on("exit", (code) => {
  scheduler?.stop();
  sink?.close();
  client.close();
  process.exit(code ?? 0);
});
