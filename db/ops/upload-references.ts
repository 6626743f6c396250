import type { Client } from "@libsql/client";

// Where the database refers to files under UPLOAD_DIR. Logger files and certificates are
// `stored_file` rows (path relative to UPLOAD_DIR, sha-prefixed folder); photos and documents on
// work orders and changes are named by their SHA-256 at the top of UPLOAD_DIR.

export type UploadReference = { path: string; sha256: string; owner: string };

export async function uploadReferences(client: Pick<Client, "execute">): Promise<UploadReference[]> {
  const refs: UploadReference[] = [];
  const stored = await client.execute("select sha256, path from stored_file where purged_at is null");
  for (const r of stored.rows) refs.push({ path: String(r.path), sha256: String(r.sha256), owner: `stored_file ${String(r.sha256).slice(0, 12)}…` });
  for (const table of ["work_order_attachment", "oven_change_attachment"]) {
    const rows = await client.execute(`select id, sha256 from ${table}`);
    for (const r of rows.rows) refs.push({ path: String(r.sha256), sha256: String(r.sha256), owner: `${table} ${r.id}` });
  }
  return refs;
}
