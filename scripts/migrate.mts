import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { env } from "../lib/env";

const { db, client } = await openDatabase(env().DATABASE_URL, env().DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
client.close();
console.log(`Migrated ${env().DATABASE_URL}`);
