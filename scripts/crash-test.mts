// npm run test:crash [-- --rounds <n>] [--keep]
// Crash safety: a fresh demo database, the built app (scripts/serve.mts) as a child process, a
// burst of concurrent run uploads, work-order closes and photo attachments, then SIGKILL to the
// whole app while some requests are answered and others are in flight; restart on the same files
// and check integrity, every 2xx answer, and that nothing is half-written. Several rounds, each
// killed at a different moment. Needs a production build (`npx next build`). Exits 1 on any failure.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import { inArray } from "drizzle-orm";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { seedDemo } from "../db/seed/seed-demo";
import { createApiToken } from "../db/queries/api-tokens";
import { getUserByEmail } from "../db/queries/users";
import { workOrders } from "../db/schema/maintenance";
import { startBuiltApp, type BuiltApp } from "./support/app-process";
import { fireBurst, planBurst, warmUp, type OpenOrder, type Outcome } from "../tests/crash/burst";
import { checkRequests } from "../tests/crash/check-requests";
import { checkInvariants } from "../tests/crash/check-invariants";

const { values } = parseArgs({ options: { rounds: { type: "string", default: "3" }, keep: { type: "boolean", default: false } } });
const ROUNDS = Number(values.rounds);
const PER_ROUND = { uploads: 12, closes: 8, attachments: 4 };
const TOTAL = PER_ROUND.uploads + PER_ROUND.closes + PER_ROUND.attachments;
// Kill after this many answers: early, middle and late in the burst, in turn.
const KILL_AFTER = [3, 10, 18, 6, 14];

if (!fs.existsSync(".next/BUILD_ID")) {
  console.error("The crash test starts the production build: run `npx next build` first.");
  process.exit(2);
}
const started = Date.now();
const secs = (from: number) => `${((Date.now() - from) / 1000).toFixed(1)} s`;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-crash-"));
const cfg = {
  databaseUrl: `file:${path.join(dir, "ovenward.db")}`,
  uploadDir: path.join(dir, "uploads"),
  port: Number(process.env.CRASH_PORT ?? 3230),
  smtpPort: Number(process.env.CRASH_SMTP_PORT ?? 2640),
  logFile: path.join(dir, "app.log"),
};
// The seed writes logger files through lib/storage, which reads UPLOAD_DIR from the environment.
process.env.DATABASE_URL = cfg.databaseUrl;
process.env.UPLOAD_DIR = cfg.uploadDir;

let t = Date.now();
const setup = await openDatabase(cfg.databaseUrl);
await migrateDatabase(setup.db);
await seedDemo(setup.db, { password: "ovenward-demo" });
const tech = (await getUserByEmail(setup.db, "tech@brightwater.example"))!;
const { secret: token } = await createApiToken(setup.db, { userId: tech.id, name: "crash test" }, null);
const ovenIds = (await setup.client.execute("select id from oven order by id limit 3")).rows.map((r) => Number(r.id));
const open = await setup.db.select().from(workOrders).where(inArray(workOrders.state, ["open", "in_progress"])).orderBy(workOrders.id).limit(ROUNDS * PER_ROUND.closes);
setup.client.close();
if (open.length < ROUNDS * PER_ROUND.closes) throw new Error(`The demo has ${open.length} unfinished work orders; ${ROUNDS * PER_ROUND.closes} are needed.`);
const orders: OpenOrder[] = open.map((o) => ({ id: o.id, version: o.version, checklist: o.checklist }));
console.log(`Demo database seeded in ${secs(t)} (${dir})`);
const since = Date.now();

const rounds: { outcomes: Outcome[]; killAfter: number }[] = [];
const failures: string[] = [];

let last = { found: 0, inFlightFound: 0, halfWritten: 0 };

/** The built app with the scheduler and the SMTP sink on, as production runs it. */
const startApp = () =>
  startBuiltApp({
    name: "app",
    port: cfg.port,
    logFile: cfg.logFile,
    timeoutMs: 90_000,
    env: {
      DATABASE_URL: cfg.databaseUrl, UPLOAD_DIR: cfg.uploadDir, AUTH_SECRET: "crash-test-secret-0123456789abcdef",
      SMTP_SINK: "on", SMTP_SINK_PORT: String(cfg.smtpPort), SMTP_URL: `smtp://127.0.0.1:${cfg.smtpPort}`, SCHEDULER: "on", DEMO_MODE: "off",
    },
  });

async function verify(app: BuiltApp, label: string) {
  const { db, client } = await openDatabase(cfg.databaseUrl);
  last = { found: 0, inFlightFound: 0, halfWritten: 0 };
  try {
    const inv = await checkInvariants(client, db, cfg.uploadDir, ovenIds, since);
    failures.push(...inv.failures.map((f) => `${label}: ${f}`));
    last.halfWritten = inv.halfWritten;
    const lines = [];
    for (const [i, round] of rounds.entries()) {
      const c = await checkRequests(client, app.url, token, round.outcomes);
      failures.push(...c.failures.map((f) => `${label}, requests of round ${i + 1}: ${f}`));
      last.found += c.found;
      last.inFlightFound += c.inFlightFound;
      const late = round.outcomes.filter((o) => o.answeredAfterKill).length;
      lines.push(
        `  round ${i + 1} (kill after ${round.killAfter} answers): sent ${round.outcomes.length}, answered 2xx ${c.answered2xx}` +
          (late ? ` (${late} read after the kill)` : "") +
          `, answered with an error ${c.answeredOther}, in flight when killed ${c.inFlight}, found after restart ${c.found} (${c.inFlightFound} of those in flight)`,
      );
    }
    console.log(`${label}: integrity ok=${!inv.failures.some((f) => f.startsWith("integrity"))}, half-written ${inv.halfWritten}, files checked ${inv.filesChecked}, temporary files left by kills ${inv.tempFilesLeft}`);
    for (const l of lines) console.log(l);
  } finally {
    client.close();
  }
}

let app: BuiltApp | null = null;
// The app runs in its own process group, so an interrupted test must take it down itself.
for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    app?.kill("SIGKILL");
    console.error(`Interrupted; files left in ${dir}`);
    process.exit(130);
  });
}
try {
  t = Date.now();
  app = await startApp();
  console.log(`App started in ${secs(t)} on ${app.url}`);
  for (let round = 0; round < ROUNDS; round++) {
    const killAfter = KILL_AFTER[round % KILL_AFTER.length];
    const planned = planBurst(round, ovenIds, orders.slice(round * PER_ROUND.closes, (round + 1) * PER_ROUND.closes), PER_ROUND);
    await warmUp(app.url, token, ovenIds[0], orders[0].id);
    t = Date.now();
    const running: BuiltApp = app;
    const { outcomes } = await fireBurst(running.url, token, planned, killAfter, () => running.crash());
    rounds.push({ outcomes, killAfter });
    for (const o of outcomes.filter((x) => x.status !== null && (x.status < 200 || x.status >= 300))) {
      failures.push(`round ${round + 1}: ${o.kind} answered ${o.status} ${JSON.stringify(o.body).slice(0, 200)}`);
    }
    const late = outcomes.filter((o) => o.answeredAfterKill).length;
    if (!outcomes.some((o) => o.status === null)) console.log(`  (every request of round ${round + 1} was answered before the kill landed)`);
    console.log(
      `Round ${round + 1}: ${TOTAL} requests at once; SIGKILL once ${killAfter} answers had been read ` +
        `(${late} more were already on their way back, ${outcomes.filter((o) => o.status === null).length} never answered), ${secs(t)}`,
    );
    t = Date.now();
    app = await startApp();
    console.log(`Restarted on the same database in ${secs(t)}`);
    t = Date.now();
    await verify(app, `After kill ${round + 1}`);
    console.log(`Checked in ${secs(t)}`);
  }
  if (!rounds.some((r) => r.outcomes.some((o) => o.status === null))) failures.push("no request was in flight at any kill: the test proved nothing (raise the burst size)");
  if (!rounds.some((r) => r.outcomes.some((o) => o.status !== null && o.status < 300))) failures.push("no request was answered before any kill");
} catch (err) {
  failures.push(`crash test stopped: ${(err as Error).stack ?? err}`);
} finally {
  if (app) await app.stop();
}

const all = rounds.flatMap((r) => r.outcomes);
console.log(
  `\nTotal over ${rounds.length} kills: sent ${all.length}, answered 2xx ${all.filter((o) => o.status !== null && o.status < 300).length}, ` +
    `in flight when killed ${all.filter((o) => o.status === null).length}, found after the last restart ${last.found} (${last.inFlightFound} of them in flight), ` +
    `half-written ${last.halfWritten}; ${failures.length} failures; ${secs(started)} in all.`,
);
if (failures.length) {
  console.error(`\nCRASH TEST FAILED (files kept in ${dir}; the app's output is in app.log):`);
  for (const f of failures.slice(0, 50)) console.error(`- ${f}`);
  process.exit(1);
}
if (values.keep) console.log(`Files kept in ${dir}`);
else fs.rmSync(dir, { recursive: true, force: true });
console.log("Crash test passed.");
