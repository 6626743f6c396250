import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as users from "./schema/users";
import * as apiTokens from "./schema/api-tokens";
import * as fleet from "./schema/fleet";
import * as audit from "./schema/audit";
import * as mail from "./schema/mail";
import * as maintenance from "./schema/maintenance";

export const schema = { ...users, ...apiTokens, ...fleet, ...audit, ...mail, ...maintenance };
export type Db = LibSQLDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;

/**
 * Opens the database. Used by the app (db/index.ts), scripts and tests alike.
 * For an embedded file the pool is one connection: SQLite has one writer anyway, and the
 * per-connection pragmas (foreign keys) then hold for every statement. busy_timeout is
 * libSQL's `timeout` option, which applies to each connection it opens.
 */
export async function openDatabase(url: string, authToken?: string): Promise<{ db: Db; client: Client }> {
  const isFile = url.startsWith("file:");
  if (isFile) {
    const path = url.slice("file:".length);
    const dir = path.includes("/") ? path.slice(0, path.lastIndexOf("/")) : "";
    if (dir) {
      const fs = await import("node:fs");
      fs.mkdirSync(dir, { recursive: true });
    }
  }
  const client = createClient({ url, authToken, concurrency: isFile ? 1 : 20, timeout: 10_000 } as Parameters<typeof createClient>[0]);
  if (isFile) {
    await client.execute("PRAGMA journal_mode=WAL");
    await client.execute("PRAGMA synchronous=NORMAL");
  }
  await client.execute("PRAGMA busy_timeout=10000");
  await client.execute("PRAGMA foreign_keys=ON");
  return { db: drizzle(client, { schema }), client };
}
