import "server-only";
import fs from "node:fs/promises";
import path from "node:path";
import type { BlobStore } from "./blob-store";
import { assertContentHash } from "./content-hash";
import { writeFileDurably } from "./fsync";

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
      await writeFileDurably(fanned(sha), bytes);
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
