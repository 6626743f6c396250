import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { tableCounts } from "./table-digest";
import { referencePresent, uploadReferences } from "./upload-references";
import { syncPath } from "../../lib/storage/fsync";

/*
 * An online backup of the embedded database while the app runs. `VACUUM INTO` reads the database
 * in one read transaction, so under WAL it copies one committed state (writers carry on meanwhile)
 * into a fresh, compact, self-contained file. Uploaded files are copied after that snapshot: they
 * are written (and flushed) before the row that names them is committed and never rewritten, so
 * every file the snapshot refers to is already there to copy.
 */

/** An expected refusal, printed as its message alone. */
export class OpsError extends Error {
  override name = "OpsError";
}

/** By name, not instanceof: a script (ESM) and these modules (CJS under tsx) may each load their own copy of the class. */
export function isOpsError(err: unknown): err is OpsError {
  return err instanceof Error && err.name === "OpsError";
}

export type BackupManifest = {
  createdAt: string;
  source: string;
  database: { file: string; bytes: number; sha256: string; integrity: "ok"; migrations: number; tables: Record<string, number> };
  uploads: { folder: string; files: number; bytes: number; referenced: number; missing: string[] };
};

/** The file behind a `file:` URL; a libSQL server is backed up with the server's own tools. */
export function databaseFile(url: string): string {
  if (!url.startsWith("file:")) {
    throw new OpsError(
      `DATABASE_URL is ${url.replace(/\/\/[^@/]*@/, "//…@")}, a libSQL server: back it up with that server's own snapshot or backup ` +
        "tools. These commands copy an embedded SQLite file only (the uploads folder still needs copying either way).",
    );
  }
  return path.resolve(url.slice("file:".length).replace(/\?.*$/, ""));
}

export function sha256File(file: string): string {
  const h = crypto.createHash("sha256");
  const fd = fs.openSync(file, "r");
  try {
    const buf = Buffer.alloc(1 << 20);
    for (let n; (n = fs.readSync(fd, buf, 0, buf.length, null)) > 0; ) h.update(buf.subarray(0, n));
  } finally {
    fs.closeSync(fd);
  }
  return h.digest("hex");
}


/** integrity_check, applied migrations and row counts of a database file (opened only to read). */
export async function inspectDatabase(file: string) {
  const client: Client = createClient({ url: `file:${file}` });
  try {
    const integrity = (await client.execute("PRAGMA integrity_check")).rows.map((r) => String(r[0]));
    if (integrity.join() !== "ok") throw new OpsError(`${file} fails PRAGMA integrity_check: ${integrity.slice(0, 3).join("; ")}`);
    const hasMigrations = (await client.execute("select 1 from sqlite_master where name = '__drizzle_migrations'")).rows.length > 0;
    if (!hasMigrations) throw new OpsError(`${file} is an SQLite file but not an Ovenward database (no migrations table).`);
    const migrations = Number((await client.execute("select count(*) as n from __drizzle_migrations")).rows[0].n);
    return { migrations, tables: await tableCounts(client), references: await uploadReferences(client) };
  } catch (err) {
    if (isOpsError(err)) throw err;
    throw new OpsError(`${file} cannot be read as a database: ${(err as Error).message}`);
  } finally {
    client.close();
  }
}

/** Copies every file of `from` missing in `to` (same relative path); files are named by their hash, so one already there is the same. */
export function copyUploads(from: string, to: string) {
  const result = { files: 0, bytes: 0, copied: 0 };
  if (!fs.existsSync(from)) return result;
  for (const rel of fs.readdirSync(from, { recursive: true }).map(String)) {
    const src = path.join(from, rel);
    // A temporary name is a write that never finished; nothing refers to it.
    if (rel.endsWith(".tmp") || !fs.statSync(src).isFile()) continue;
    result.files++;
    result.bytes += fs.statSync(src).size;
    const dst = path.join(to, rel);
    if (fs.existsSync(dst)) continue;
    fs.mkdirSync(path.dirname(dst), { recursive: true });
    fs.copyFileSync(src, `${dst}.tmp`);
    syncPath(`${dst}.tmp`);
    fs.renameSync(`${dst}.tmp`, dst);
    result.copied++;
  }
  return result;
}

export async function backupDatabase({ url, out, uploadDir }: { url: string; out: string; uploadDir: string | null }): Promise<BackupManifest & { manifestFile: string }> {
  const source = databaseFile(url);
  if (!fs.existsSync(source)) throw new OpsError(`There is no database at ${source} to back up.`);
  const target = path.resolve(out);
  for (const p of [target, `${target}.json`, `${target}.uploads`]) {
    if (fs.existsSync(p)) throw new OpsError(`${p} already exists; choose another --out (a backup never overwrites one).`);
  }
  fs.mkdirSync(path.dirname(target), { recursive: true });
  const partial = `${target}.partial`;
  fs.rmSync(partial, { force: true });

  const client = createClient({ url: `file:${source}` });
  try {
    // Wait for a writer's commit rather than fail; the copy itself never blocks the app.
    await client.execute("PRAGMA busy_timeout = 10000");
    await client.execute({ sql: "VACUUM INTO ?", args: [partial] });
  } finally {
    client.close();
  }
  syncPath(partial);
  fs.renameSync(partial, target);
  syncPath(path.dirname(target));

  const inspected = await inspectDatabase(target);
  const uploadsFolder = `${target}.uploads`;
  // With STORAGE=s3 (uploadDir null) the files stay in the bucket: its versioning or replication keeps them.
  const copied = uploadDir ? copyUploads(path.resolve(uploadDir), uploadsFolder) : { files: 0, bytes: 0, copied: 0 };
  const missing = uploadDir ? inspected.references.filter((r) => !referencePresent(uploadsFolder, r)).map((r) => `${r.owner}: ${r.path}`) : [];
  const manifest: BackupManifest = {
    createdAt: new Date().toISOString(),
    source,
    database: { file: path.basename(target), bytes: fs.statSync(target).size, sha256: sha256File(target), integrity: "ok", migrations: inspected.migrations, tables: inspected.tables },
    uploads: { folder: path.basename(uploadsFolder), files: copied.files, bytes: copied.bytes, referenced: inspected.references.length, missing },
  };
  const manifestFile = `${target}.json`;
  fs.writeFileSync(manifestFile, JSON.stringify(manifest, null, 2) + "\n");
  return { ...manifest, manifestFile };
}
