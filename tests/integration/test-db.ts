import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase, type Db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed/seed-demo";
import { getUserByEmail } from "@/db/queries/users";
import type { Actor } from "@/lib/actor";
import type { Role } from "@/db/schema/users";

/** A real libSQL database in a temporary file, migrated and (optionally) seeded with the demo. */
export async function createTestDb({ seed = true } = {}) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-test-"));
  const url = `file:${path.join(dir, "test.db")}`;
  const { db, client } = await openDatabase(url);
  await migrateDatabase(db);
  if (seed) await seedDemo(db, { password: "ovenward-demo" });
  return {
    db,
    url,
    close: () => {
      client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

export async function actorFor(db: Db, role: Role): Promise<Actor> {
  const email = role === "technician" ? "tech@brightwater.example" : `${role}@brightwater.example`;
  const u = await getUserByEmail(db, email);
  if (!u) throw new Error(`no demo user for ${role}`);
  return { kind: "session", userId: u.id, tokenId: null, email: u.email, name: u.name, role: u.role };
}
