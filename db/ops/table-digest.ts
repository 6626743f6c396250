import crypto from "node:crypto";
import type { Client } from "@libsql/client";

// Row counts and a content digest per table, to compare two databases table by table (a backup
// with its source, a restored copy with the backup) whatever their page layout on disk.

export async function tableNames(client: Pick<Client, "execute">): Promise<string[]> {
  const rs = await client.execute("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name");
  return rs.rows.map((r) => String(r.name));
}

export async function tableCounts(client: Pick<Client, "execute">): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const name of await tableNames(client)) {
    counts[name] = Number((await client.execute(`select count(*) as n from "${name}"`)).rows[0].n);
  }
  return counts;
}

/** Every row in rowid order, each value with its type, hashed: equal digests mean equal contents. */
export async function tableDigests(client: Pick<Client, "execute">): Promise<Record<string, { rows: number; sha256: string }>> {
  const out: Record<string, { rows: number; sha256: string }> = {};
  for (const name of await tableNames(client)) {
    const rs = await client.execute(`select * from "${name}" order by rowid`);
    const h = crypto.createHash("sha256");
    for (const row of rs.rows) {
      for (let i = 0; i < rs.columns.length; i++) {
        const v = row[i];
        const bytes = v instanceof ArrayBuffer ? new Uint8Array(v) : Buffer.from(v === null ? "" : String(v));
        // Type and length first, so "5" and 5, or two values split differently, never hash alike.
        h.update(`${v === null ? "n" : v instanceof ArrayBuffer ? "b" : typeof v === "string" ? "s" : "r"}${bytes.length}:`);
        h.update(bytes);
      }
    }
    out[name] = { rows: rs.rows.length, sha256: h.digest("hex") };
  }
  return out;
}
