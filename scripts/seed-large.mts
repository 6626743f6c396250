// npm run seed:large [-- --end YYYY-MM-DD] [--replace] [--ovens <n>]
// Seeds the large data set (200 ovens on 4 sites, three years of daily runs, 60 000 work orders,
// 5 000 changes) into its own database: DATABASE_URL, or file:./data/large.db by default.
// The default file is replaced on every run; another database must be empty unless --replace.
// Prints the counts, the time taken and a fingerprint of the data: the fingerprint does not
// depend on --end (times are taken from the history's start), so two runs can be compared.
// --ovens seeds only the first n ovens (work orders scaled to match), for a quick look.
import fs from "node:fs";
import os from "node:os";
import { Worker } from "node:worker_threads";
import { parseArgs } from "node:util";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { seedLarge, type BuildRuns } from "../db/seed/seed-large";
import { env } from "../lib/env";
import { largeFingerprint, tableCounts } from "../db/seed/large-report";

const DEFAULT_URL = "file:./data/large.db";
const { values } = parseArgs({ options: { end: { type: "string" }, replace: { type: "boolean", default: false }, ovens: { type: "string" } } });
const url = process.env.DATABASE_URL ?? DEFAULT_URL;
const end = values.end ? new Date(`${values.end}T00:00:00Z`) : new Date();
const ovenCount = values.ovens ? Number(values.ovens) : 200;
if (!Number.isInteger(ovenCount) || ovenCount < 1 || ovenCount > 200) {
  console.error(`--ovens must be a whole number from 1 to 200 (got "${values.ovens}").`);
  process.exit(2);
}
if (Number.isNaN(end.getTime())) {
  console.error(`--end must be a date like 2026-01-31 (got "${values.end}").`);
  process.exit(2);
}

/** Worker threads that build ovens' runs (simulation and analysis are most of the work). */
function workerPool(size: number): { build: BuildRuns; close: () => Promise<void> } {
  const idle = Array.from({ length: size }, () => new Worker(new URL("./_shims/ts-worker.mjs", import.meta.url), { workerData: { entry: new URL("../db/seed/large-runs-worker.ts", import.meta.url).href } }));
  const all = [...idle];
  const queue: (() => void)[] = [];
  const build: BuildRuns = async (index, ctx) => {
    while (!idle.length) await new Promise<void>((r) => queue.push(r));
    const worker = idle.pop()!;
    try {
      const reply = await new Promise<{ batch?: Awaited<ReturnType<BuildRuns>>; error?: string }>((resolve, reject) => {
        worker.once("message", resolve);
        worker.once("error", reject);
        worker.postMessage({ index, ctx });
      });
      if (reply.error) throw new Error(`Building the runs of oven ${index + 1} failed: ${reply.error}`);
      return reply.batch!;
    } finally {
      worker.removeAllListeners("error");
      idle.push(worker);
      queue.shift()?.();
    }
  };
  return { build, close: async () => void (await Promise.all(all.map((w) => w.terminate()))) };
}

const started = Date.now();
if (url.startsWith("file:")) {
  const file = url.slice("file:".length);
  if (fs.existsSync(file) && url !== DEFAULT_URL && !values.replace) {
    console.error(`${file} already exists. Pass --replace to overwrite it, or point DATABASE_URL at a new file.`);
    process.exit(2);
  }
  for (const suffix of ["", "-wal", "-shm"]) fs.rmSync(file + suffix, { force: true });
}
const { db, client } = await openDatabase(url, process.env.DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
// A larger page cache for this one connection: ten indexes on the run table take inserts all
// over their range (every oven's three years), and the default 2 MB made that mostly page reads.
if (url.startsWith("file:")) await client.execute("PRAGMA cache_size = -262144");
const [{ n }] = (await client.execute("select count(*) as n from oven")).rows as unknown as { n: number }[];
if (Number(n) > 0) {
  console.error(`The database at ${url} already has ovens; seed:large needs an empty one.`);
  client.close();
  process.exit(2);
}
console.log(`Seeding the large data set into ${url} (history ends ${new Date(Math.floor(end.getTime() / 86_400_000) * 86_400_000 - 1).toISOString().slice(0, 10)})`);
const threads = Math.max(1, os.availableParallelism());
const pool = workerPool(threads);
const result = await seedLarge(db, { end, password: env().DEMO_PASSWORD, ovenCount, buildRuns: pool.build, ahead: threads, log: (line) => console.log(`  ${((Date.now() - started) / 1000).toFixed(0).padStart(4)} s  ${line}`) });
await pool.close();
if (url.startsWith("file:")) await client.execute("PRAGMA wal_checkpoint(TRUNCATE)");
const seconds = (Date.now() - started) / 1000;
console.table(await tableCounts(client));
console.log(`Fingerprint ${await largeFingerprint(client, result.start.getTime())}`);
client.close();
const size = url.startsWith("file:") ? ` (${(fs.statSync(url.slice(5)).size / 1024 / 1024).toFixed(0)} MB)` : "";
console.log(`Seeded the large data set in ${seconds.toFixed(0)} s${size}. Sign in as any demo user (password "${env().DEMO_PASSWORD}").`);
console.log(`Serve it: DATABASE_URL=${url} npm run serve   ·   benchmark it: npm run bench`);
