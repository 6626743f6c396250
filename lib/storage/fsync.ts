import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * Writes a file so that its final name only ever holds the whole content: bytes go to a
 * temporary name, are flushed to disk, then renamed, and the folder entry is flushed too. The
 * database row that refers to the file is committed only after this returns, so neither a killed
 * process nor a power cut leaves a row pointing at a missing or half-written file. An existing
 * file is never rewritten (put checks first): rows may refer to it.
 */
export function writeFileDurably(abs: string, bytes: Uint8Array): void {
  const dir = path.dirname(abs);
  fs.mkdirSync(dir, { recursive: true });
  const tmp = `${abs}.${crypto.randomUUID()}.tmp`;
  const fd = fs.openSync(tmp, "w");
  try {
    fs.writeSync(fd, bytes);
    fs.fsyncSync(fd);
  } finally {
    fs.closeSync(fd);
  }
  fs.renameSync(tmp, abs);
  syncPath(dir);
}

/** Flushes a file or folder entry to disk; folders cannot be opened for syncing on every platform. */
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
