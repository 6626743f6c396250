import "server-only";
import { openDatabase, type Db } from "./client";
import { env } from "@/lib/env";

// One database per server process, opened lazily on first use (and again only if DATABASE_URL
// itself changes, as it does between a test's setup and its requests).
const g = globalThis as unknown as { __ovenwardDb?: { url: string; db: Promise<Db> } };

export function getDb(): Promise<Db> {
  const { DATABASE_URL: url, DATABASE_AUTH_TOKEN: token } = env();
  if (g.__ovenwardDb?.url !== url) g.__ovenwardDb = { url, db: openDatabase(url, token).then((r) => r.db) };
  return g.__ovenwardDb.db;
}
