import fs from "node:fs";
import path from "node:path";
import { copyUploads, databaseFile, inspectDatabase, OpsError, sha256File, type BackupManifest } from "./backup";
import { syncPath } from "../../lib/storage/fsync";
import { referencePresent } from "./upload-references";

/*
 * Puts a backup in place of the database. The app must be stopped: a running app keeps the old
 * file open and would go on writing to it. The backup is checked first (its manifest's SHA-256,
 * then integrity_check on the very copy that will be used); the current database is kept aside,
 * with its WAL, under a dated name; only then is the checked copy renamed into place.
 */

/**
 * Other processes that have one of the files open, from /proc; null where there is no /proc.
 * This process is left out: a libSQL handle it closed keeps its file open until collected.
 */
export function processesHolding(files: string[]): { pid: number; command: string }[] | null {
  if (!fs.existsSync("/proc/self/fd")) return null;
  const wanted = new Set(files.map((f) => path.resolve(f)));
  const found: { pid: number; command: string }[] = [];
  for (const pid of fs.readdirSync("/proc").filter((d) => /^\d+$/.test(d) && Number(d) !== process.pid)) {
    let fds: string[];
    try {
      fds = fs.readdirSync(`/proc/${pid}/fd`);
    } catch {
      continue; // gone, or another user's process
    }
    const holds = fds.some((fd) => {
      try {
        return wanted.has(fs.readlinkSync(`/proc/${pid}/fd/${fd}`));
      } catch {
        return false;
      }
    });
    if (holds) {
      const command = fs.readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").filter(Boolean).slice(0, 3).join(" ");
      found.push({ pid: Number(pid), command });
    }
  }
  return found;
}

function removeStaged(staged: string, withFile: boolean) {
  for (const suffix of [...(withFile ? [""] : []), "-wal", "-shm", "-journal"]) fs.rmSync(staged + suffix, { force: true });
}

function stamp(now: Date) {
  return now.toISOString().replace(/[-:]/g, "").replace(/\..*$/, "").replace("T", "-");
}

export async function restoreDatabase({ url, from, uploadDir, force = false, now = new Date() }: { url: string; from: string; uploadDir: string; force?: boolean; now?: Date }) {
  const target = databaseFile(url);
  const backup = path.resolve(from);
  if (!fs.existsSync(backup)) throw new OpsError(`There is no backup at ${backup}.`);
  if (backup === target) throw new OpsError("The backup is the database itself; give the path of a backup file.");

  if (!force) {
    const holders = processesHolding([target, `${target}-wal`]);
    if (holders === null) throw new OpsError("Cannot tell on this system whether the app is running. Stop it, then run the restore again with --force.");
    if (holders.length) {
      const list = holders.map((h) => `${h.pid} (${h.command})`).join(", ");
      throw new OpsError(`The database ${target} is open in process ${list}. Stop the app first (or pass --force if you are sure nothing writes to it).`);
    }
  }

  const manifestFile = `${backup}.json`;
  const manifest = fs.existsSync(manifestFile) ? (JSON.parse(fs.readFileSync(manifestFile, "utf8")) as BackupManifest) : null;
  if (manifest && sha256File(backup) !== manifest.database.sha256) {
    throw new OpsError(`${backup} does not match the SHA-256 in ${manifestFile}: the file was changed or cut short since the backup.`);
  }

  // Check the copy that will be used, in the target's folder, so the final step is one rename.
  fs.mkdirSync(path.dirname(target), { recursive: true });
  const staged = `${target}.restoring-${stamp(now)}`;
  fs.copyFileSync(backup, staged);
  syncPath(staged);
  let inspected;
  try {
    inspected = await inspectDatabase(staged);
    if (manifest) {
      const differ = Object.entries(manifest.database.tables).filter(([t, n]) => inspected!.tables[t] !== n);
      if (differ.length) throw new OpsError(`${backup} has other row counts than its manifest (${differ.map(([t]) => t).join(", ")}).`);
    }
  } catch (err) {
    removeStaged(staged, true);
    throw err;
  } finally {
    // A copy in WAL mode gets a -wal and -shm when opened; they hold nothing once inspected.
    removeStaged(staged, false);
  }

  let keptAside: string | null = null;
  if (fs.existsSync(target)) {
    keptAside = `${target}.before-restore-${stamp(now)}`;
    // The WAL and its index go with the file: a WAL may hold commits not yet copied into it.
    for (const suffix of ["", "-wal", "-shm"]) {
      if (fs.existsSync(target + suffix)) fs.renameSync(target + suffix, keptAside + suffix);
    }
  }
  fs.renameSync(staged, target);
  syncPath(path.dirname(target));

  const uploads = copyUploads(`${backup}.uploads`, path.resolve(uploadDir));
  const missing = inspected.references.filter((r) => !referencePresent(path.resolve(uploadDir), r)).map((r) => `${r.owner}: ${r.path}`);
  return { target, keptAside, migrations: inspected.migrations, tables: inspected.tables, uploads: { ...uploads, folder: path.resolve(uploadDir), missing } };
}
