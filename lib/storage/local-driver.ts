import "server-only";
import fsSync from "node:fs";
import fs from "node:fs/promises";
import crypto from "node:crypto";
import path from "node:path";
import type { BlobStore } from "./blob-store";
import { assertContentHash } from "./content-hash";

/**
 * Files in a folder of this machine, at `<root>/<first two hex digits>/<sha256>`. Work-order and
 * change attachments used to be written flat (`<root>/<sha256>`); those are still found, read and
 * removed where they are, so no folder needs moving on upgrade.
 */
export function localBlobStore(dir: string): BlobStore {
  const root = path.resolve(dir);
  const fanned = (sha: string) => {
    assertContentHash(sha);
    return path.join(root, sha.slice(0, 2), sha);
  };
  const flat = (sha: string) => path.join(root, sha);
  const isFile = (p: string) => fs.stat(p).then((s) => s.isFile(), () => false);
  const exists = async (sha: string) => (await isFile(fanned(sha))) || (await isFile(flat(sha)));

  return {
    kind: "local",
    exists,
    async put(sha, bytes) {
      if (await exists(sha)) return { created: false };
      writeFileDurably(fanned(sha), bytes);
      return { created: true };
    },
    async get(sha) {
      for (const p of [fanned(sha), flat(sha)]) {
        try {
          return await fs.readFile(p);
        } catch (e) {
          if ((e as NodeJS.ErrnoException).code !== "ENOENT") throw e;
        }
      }
      return null;
    },
    async delete(sha) {
      await fs.rm(fanned(sha), { force: true });
      await fs.rm(flat(sha), { force: true });
    },
  };
}

/**
 * Writes a file so that its final name only ever holds the whole content: bytes go to a
 * temporary name, are flushed to disk, then renamed, and the folder entry is flushed too. The
 * database row that refers to the file is committed only after this returns, so neither a killed
 * process nor a power cut leaves a row pointing at a missing or half-written file. An existing
 * file is never rewritten (put checks first): rows may refer to it.
 */
export function writeFileDurably(abs: string, bytes: Uint8Array): void {
  const dir = path.dirname(abs);
  fsSync.mkdirSync(dir, { recursive: true });
  const tmp = `${abs}.${crypto.randomUUID()}.tmp`;
  const fd = fsSync.openSync(tmp, "w");
  try {
    fsSync.writeSync(fd, bytes);
    fsSync.fsyncSync(fd);
  } finally {
    fsSync.closeSync(fd);
  }
  fsSync.renameSync(tmp, abs);
  syncFolder(dir);
}

function syncFolder(dir: string) {
  let fd: number | undefined;
  try {
    fd = fsSync.openSync(dir, "r");
    fsSync.fsyncSync(fd);
  } catch {
    // Some platforms (Windows) cannot open a folder for syncing; the rename is then as durable as the OS makes it.
  } finally {
    if (fd !== undefined) fsSync.closeSync(fd);
  }
}
