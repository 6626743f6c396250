import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase, type Db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed/seed-demo";
import { getUserByEmail } from "@/db/queries/users";
import type { Actor } from "@/lib/actor";
import type { Role } from "@/db/schema/users";

/**
 * The seeded demo (eighteen months of runs) takes seconds to build, so it is built once per
 * migrations + seed source + day, in the temp folder, and each test gets a copy of the file.
 */
function templateKey(): string {
  const h = crypto.createHash("sha256");
  for (const folder of ["db/migrations", "db/seed", "db/schema", "db/queries", "lib/thermal"]) {
    for (const f of fs.readdirSync(path.join(process.cwd(), folder), { recursive: true }).map(String).sort()) {
      const p = path.join(process.cwd(), folder, f);
      if (fs.statSync(p).isFile()) h.update(f).update(fs.readFileSync(p));
    }
  }
  h.update(new Date().toISOString().slice(0, 10));
  return h.digest("hex").slice(0, 16);
}

async function seededTemplate(): Promise<string> {
  const file = path.join(os.tmpdir(), `ovenward-template-${templateKey()}.db`);
  if (fs.existsSync(file)) return file;
  const building = `${file}.${process.pid}.build`;
  const { db, client } = await openDatabase(`file:${building}`);
  await migrateDatabase(db);
  await seedDemo(db, { password: "ovenward-demo" });
  await client.execute("PRAGMA wal_checkpoint(TRUNCATE)");
  await client.execute("PRAGMA journal_mode=DELETE");
  client.close();
  fs.renameSync(building, file);
  return file;
}

/** A real libSQL database in a temporary file, migrated and (optionally) seeded with the demo. */
export async function createTestDb({ seed = true } = {}) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ovenward-test-"));
  const url = `file:${path.join(dir, "test.db")}`;
  if (seed) fs.copyFileSync(await seededTemplate(), path.join(dir, "test.db"));
  const { db, client } = await openDatabase(url);
  await migrateDatabase(db);
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
