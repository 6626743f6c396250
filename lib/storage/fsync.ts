import crypto from "node:crypto";
import fs from "node:fs";
import fsp from "node:fs/promises";
import path from "node:path";

/**
 * Writes a file so that its final name only ever holds the whole content: bytes go to a
 * temporary name, are flushed to disk, then renamed, and the folder entry is flushed too. The
 * database row that refers to the file is committed only after this returns, so neither a killed
 * process nor a power cut leaves a row pointing at a missing or half-written file. An existing
 * file is never rewritten (put checks first): rows may refer to it.
 */
export async function writeFileDurably(abs: string, bytes: Uint8Array): Promise<void> {
  // Asynchronous throughout: a flush of a 20 MB logger file must not stop the server's other requests.
  const dir = path.dirname(abs);
  await fsp.mkdir(dir, { recursive: true });
  const tmp = `${abs}.${crypto.randomUUID()}.tmp`;
  const file = await fsp.open(tmp, "w");
  try {
    await file.writeFile(bytes);
    await file.sync();
  } finally {
    await file.close();
  }
  await fsp.rename(tmp, abs);
  const folder = await fsp.open(dir, "r").catch(() => null); // not every platform opens folders
  if (folder) await folder.sync().catch(() => undefined).finally(() => folder.close());
}

/** Flushes a file or folder entry to disk, for the backup scripts; folders cannot be opened for syncing on every platform. */
export function syncPath(p: string) {
  let fd: number | undefined;
  try {
    fd = fs.openSync(p, "r");
    fs.fsyncSync(fd);
  } catch {
    // Some platforms (Windows) cannot open a folder for syncing; the rename is then as durable as the OS makes it.
  } finally {
    if (fd !== undefined) fs.closeSync(fd);
  }
}
