// npm run db:backup [-- --out <file>]
// An online, consistent copy of the embedded database (safe while the app runs) plus the uploaded
// files it refers to: <file>, <file>.uploads/ and <file>.json (checksum, row counts, file counts).
import path from "node:path";
import { parseArgs } from "node:util";
import { backupDatabase, isOpsError } from "../db/ops/backup";
import { env } from "../lib/env";

const { values } = parseArgs({ options: { out: { type: "string" } } });
const stamp = new Date().toISOString().replace(/[-:]/g, "").replace(/\..*$/, "").replace("T", "-");
const out = values.out ?? path.join("data", "backups", `ovenward-${stamp}.db`);
try {
  const started = Date.now();
  const inBucket = env().STORAGE === "s3";
  const b = await backupDatabase({ url: env().DATABASE_URL, out, uploadDir: inBucket ? null : env().UPLOAD_DIR });
  const rows = Object.values(b.database.tables).reduce((a, n) => a + n, 0);
  const mb = (n: number) => `${(n / 1048576).toFixed(1)} MB`;
  console.log(`Backed up ${b.source}`);
  console.log(`  database  ${path.resolve(out)}  ${mb(b.database.bytes)}, ${Object.keys(b.database.tables).length} tables, ${rows} rows, ${b.database.migrations} migrations, integrity ok`);
  if (inBucket) console.log(`  uploads   not copied: STORAGE=s3 keeps them in the bucket ${env().S3_BUCKET}; back it up with the bucket's versioning or replication`);
  else console.log(`  uploads   ${path.resolve(out)}.uploads/  ${b.uploads.files} files, ${mb(b.uploads.bytes)}; the database refers to ${b.uploads.referenced}`);
  console.log(`  manifest  ${b.manifestFile}  (SHA-256 ${b.database.sha256.slice(0, 16)}…)`);
  console.log(`  in ${((Date.now() - started) / 1000).toFixed(1)} s. Keep a copy on another disk or machine.`);
  if (b.uploads.missing.length) {
    console.warn(`Warning: ${b.uploads.missing.length} files the database refers to were already missing from ${env().UPLOAD_DIR}:`);
    for (const m of b.uploads.missing.slice(0, 10)) console.warn(`  ${m}`);
  }
} catch (err) {
  if (!isOpsError(err)) throw err;
  console.error(err.message);
  process.exit(2);
}
