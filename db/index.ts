import "server-only";
import { openDatabase, type Db } from "./client";
import { env } from "@/lib/env";

// One database per server process, opened lazily on first use.
const g = globalThis as unknown as { __ovenwardDb?: Promise<Db> };

export function getDb(): Promise<Db> {
  if (!g.__ovenwardDb) {
    g.__ovenwardDb = openDatabase(env().DATABASE_URL, env().DATABASE_AUTH_TOKEN).then((r) => r.db);
  }
  return g.__ovenwardDb;
}
