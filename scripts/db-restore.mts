// npm run db:restore -- <backup file> [--force]
// Replaces the embedded database with a backup made by db:backup, and puts back the uploaded
// files of <file>.uploads/ that are missing. Refuses while the app has the database open
// (--force skips that check); the current database is kept aside under a dated name.
import { parseArgs } from "node:util";
import { isOpsError } from "../db/ops/backup";
import { restoreDatabase } from "../db/ops/restore";
import { env } from "../lib/env";

const { values, positionals } = parseArgs({ options: { force: { type: "boolean", default: false } }, allowPositionals: true });
if (positionals.length !== 1) {
  console.error("Usage: npm run db:restore -- <backup file> [--force]");
  process.exit(2);
}
try {
  const r = await restoreDatabase({ url: env().DATABASE_URL, from: positionals[0], uploadDir: env().UPLOAD_DIR, force: values.force });
  const rows = Object.values(r.tables).reduce((a, n) => a + n, 0);
  console.log(`Restored ${positionals[0]} to ${r.target}: integrity ok, ${Object.keys(r.tables).length} tables, ${rows} rows, ${r.migrations} migrations.`);
  console.log(r.keptAside ? `The database it replaced is kept as ${r.keptAside}.` : "There was no database there before.");
  console.log(`Uploads: ${r.uploads.copied} files put back into ${r.uploads.folder} (${r.uploads.files - r.uploads.copied} were already there).`);
  if (r.uploads.missing.length) {
    console.warn(`Warning: ${r.uploads.missing.length} files the database refers to are not in ${r.uploads.folder}:`);
    for (const m of r.uploads.missing.slice(0, 10)) console.warn(`  ${m}`);
  }
  console.log("Start the app as usual; it applies any newer migrations on start.");
} catch (err) {
  if (!isOpsError(err)) throw err;
  console.error(err.message);
  process.exit(2);
}
