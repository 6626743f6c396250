import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { seedDemo } from "../db/seed/seed-demo";
import { DEMO_USERS } from "../db/seed/demo-plant";
import { env } from "../lib/env";

const started = Date.now();
const { db, client } = await openDatabase(env().DATABASE_URL, env().DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
const counts = await seedDemo(db, { password: env().DEMO_PASSWORD });
client.close();
console.log(`Seeded the Brightwater demo in ${Date.now() - started} ms (new rows: ${JSON.stringify(counts)}).`);
console.log(`Demo sign-ins (password "${env().DEMO_PASSWORD}"):`);
for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(10)} ${u.email}`);
