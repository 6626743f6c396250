// The server the end-to-end tests drive: a fresh database with the demo seed, then the built app.
import fs from "node:fs";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { seedDemo } from "../db/seed/seed-demo";
import { env } from "../lib/env";

const file = env().DATABASE_URL.replace(/^file:/, "");
for (const suffix of ["", "-wal", "-shm"]) fs.rmSync(file + suffix, { force: true });
const { db, client } = await openDatabase(env().DATABASE_URL);
await migrateDatabase(db);
await seedDemo(db, { password: env().DEMO_PASSWORD });
client.close();
await import("./serve" + ".mts");
