// npm run test:deploy — two app instances on one libSQL server (sqld) and one S3-compatible bucket,
// as in the README's deployment section, on this machine. Needs a production build (`npx next build`).
// Ports: DEPLOY_SQLD_PORT, DEPLOY_S3_PORT, DEPLOY_APP_A_PORT, DEPLOY_APP_B_PORT, DEPLOY_SMTP_PORT
// (each a free one when unset). Prints every check; exits non-zero when one fails.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { HeadObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { portFrom, startInstance, startSqld } from "./support/deploy-stack";
import type { Started } from "./support/app-process";
import { startFakeS3, type FakeS3 } from "./support/fake-s3";
import { checkCron, checkSharedRun, checkSignedIn, type Check } from "./support/deploy-checks";

if (!fs.existsSync(".next/BUILD_ID")) {
  console.error("No production build: run `npx next build` first (npm test builds one too).");
  process.exit(1);
}
const began = Date.now();
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-deploy-"));
const procs: Started[] = [];
let s3: FakeS3 | null = null;
let closeDb: (() => void) | null = null;
let closeSink: (() => void) | null = null;
let passed = 0;
const failed: string[] = [];

const check: Check = (name, ok, detail) => {
  console.log(`${ok ? "  ✓" : "  ✗"} ${name}${detail ? ` — ${detail}` : ""}`);
  if (ok) passed++;
  else failed.push(name);
};

async function cleanup() {
  for (const p of procs.reverse()) await p.stop();
  closeSink?.();
  closeDb?.();
  await s3?.close().catch(() => undefined);
  if (!failed.length) fs.rmSync(dir, { recursive: true, force: true });
  else console.log(`\nLogs and data kept in ${dir}`);
}

try {
  const [sqldPort, s3Port, portA, portB, smtpPort] = [await portFrom("DEPLOY_SQLD_PORT"), await portFrom("DEPLOY_S3_PORT"), await portFrom("DEPLOY_APP_A_PORT"), await portFrom("DEPLOY_APP_B_PORT"), await portFrom("DEPLOY_SMTP_PORT")];
  const sqld = await startSqld({ dir, port: sqldPort });
  procs.push(sqld);
  s3 = await startFakeS3({ port: s3Port, bucket: "ovenward-deploy", dir: path.join(dir, "bucket") });
  console.log(`sqld on ${sqld.url}, fake S3 on ${s3.endpoint} (bucket ${s3.bucket}), work folder ${dir}`);

  // What every instance shares. UPLOAD_DIR points at a folder per instance that must stay empty.
  const shared: Record<string, string> = {
    DATABASE_URL: sqld.url, ...s3.env, S3_PREFIX: "files/",
    AUTH_SECRET: "deploy-test-secret-0123456789abcdef", CRON_SECRET: "deploy-test-cron-0123456789",
    SCHEDULER: "off", SMTP_SINK: "off", SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, DEMO_MODE: "off", DEMO_PASSWORD: "ovenward-demo",
  };
  Object.assign(process.env, shared, { UPLOAD_DIR: path.join(dir, "uploads-seed") });

  // The modules below read the settings when first used, so they come after them.
  const { openDatabase } = await import("../db/client");
  const { migrateDatabase } = await import("../db/migrate");
  const { seedDemo } = await import("../db/seed/seed-demo");
  const { startMailSink } = await import("../lib/mail-sink");
  const { db, client } = await openDatabase(sqld.url);
  closeDb = () => client.close();
  let t = Date.now();
  await migrateDatabase(db);
  const counts = await seedDemo(db, { password: "ovenward-demo" });
  console.log(`Migrated and seeded the demo into sqld in ${((Date.now() - t) / 1000).toFixed(1)} s (${counts.runs} runs).`);
  const sink = await startMailSink({ db, port: smtpPort });
  closeSink = () => sink.close();

  t = Date.now();
  const [a, b] = await Promise.all([
    startInstance({ name: "instance-a", dir, port: portA, env: { ...shared, UPLOAD_DIR: path.join(dir, "uploads-a") } }),
    startInstance({ name: "instance-b", dir, port: portB, env: { ...shared, UPLOAD_DIR: path.join(dir, "uploads-b") } }),
  ]);
  procs.push(a, b);
  console.log(`Two instances answering (${a.url}, ${b.url}) after ${((Date.now() - t) / 1000).toFixed(1)} s.\n`);

  console.log("Both instances serve, from the one database:");
  for (const inst of [a, b]) {
    const res = await fetch(`${inst.url}/api/health`);
    check(`${inst.name} GET /api/health`, res.status === 200 && (await res.json()).status === "ok", `HTTP ${res.status}`);
  }
  await checkSignedIn({ db, a, b, check });

  console.log("A run uploaded through A is read through B, its file from the bucket:");
  const raw = new S3Client({ region: "us-east-1", endpoint: s3.endpoint, forcePathStyle: true, credentials: { accessKeyId: shared.S3_ACCESS_KEY_ID, secretAccessKey: shared.S3_SECRET_ACCESS_KEY } });
  const inBucket = (sha: string) => raw.send(new HeadObjectCommand({ Bucket: s3!.bucket, Key: `files/${sha.slice(0, 2)}/${sha}` })).then(() => true, () => false);
  await checkSharedRun({ db, a, b, check, inBucket });
  for (const name of ["uploads-a", "uploads-b"]) {
    const folder = path.join(dir, name);
    const files = fs.existsSync(folder) ? fs.readdirSync(folder, { recursive: true }).length : 0;
    check(`nothing written to ${name}'s local folder`, files === 0, `${files} entries`);
  }
  raw.destroy();

  console.log("Concurrent POST /api/cron/tick to both instances:");
  await checkCron({ db, a, b, check, secret: shared.CRON_SECRET });
} catch (err) {
  check("the deployment test ran to the end", false, (err as Error).stack ?? String(err));
} finally {
  if (failed.length) for (const p of procs) console.log(`\n${p.name} log (${p.log}):\n${p.tail(20)}`);
  await cleanup();
}
console.log(`\nDeployment test: ${passed} passed, ${failed.length} failed in ${((Date.now() - began) / 1000).toFixed(1)} s.`);
process.exit(failed.length ? 1 : 0);
