import fs from "node:fs";
import path from "node:path";
import type { Client } from "@libsql/client";
import { contentKey } from "../../lib/storage/content-hash";

// Where the database refers to files under UPLOAD_DIR (STORAGE=local). Logger files and
// certificates are `stored_file` rows (path relative to UPLOAD_DIR); photos and documents on work
// orders and changes are named by their SHA-256 alone and stored under the same `<2 hex>/<sha>`
// key — or, when an older version wrote them, flat at the top of UPLOAD_DIR.

export type UploadReference = { path: string; sha256: string; owner: string };

export async function uploadReferences(client: Pick<Client, "execute">): Promise<UploadReference[]> {
  const refs: UploadReference[] = [];
  const stored = await client.execute("select sha256, path from stored_file where purged_at is null");
  for (const r of stored.rows) refs.push({ path: String(r.path), sha256: String(r.sha256), owner: `stored_file ${String(r.sha256).slice(0, 12)}…` });
  for (const table of ["work_order_attachment", "oven_change_attachment"]) {
    const rows = await client.execute(`select id, sha256 from ${table}`);
    for (const r of rows.rows) {
      const sha = String(r.sha256);
      refs.push({ path: contentKey(sha), sha256: sha, owner: `${table} ${r.id}` });
    }
  }
  return refs;
}

/** Whether a referenced file is in a folder, at its key or where older versions put it (flat). */
export function referencePresent(folder: string, ref: UploadReference): boolean {
  return fs.existsSync(path.join(folder, ref.path)) || fs.existsSync(path.join(folder, ref.sha256));
}
