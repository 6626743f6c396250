// npm run token:create -- --email <user e-mail> --name <label> [--role <role>]
// Prints a new API token for that user; the token is the last line of output.
import { parseArgs } from "node:util";
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { createApiToken } from "../db/queries/api-tokens";
import { getUserByEmail } from "../db/queries/users";
import { ROLES, type Role } from "../db/schema/users";
import { env } from "../lib/env";

const { values } = parseArgs({ options: { email: { type: "string" }, name: { type: "string" }, role: { type: "string" } } });
if (!values.email || !values.name) {
  console.error("Usage: npm run token:create -- --email <user e-mail> --name <label> [--role <role>]");
  process.exit(2);
}
if (values.role && !ROLES.includes(values.role as Role)) {
  console.error(`--role must be one of ${ROLES.join(", ")}.`);
  process.exit(2);
}
const { db, client } = await openDatabase(env().DATABASE_URL, env().DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
const user = await getUserByEmail(db, values.email);
if (!user) {
  console.error(`No user has the e-mail ${values.email}. Invite them first (Settings → People).`);
  process.exit(2);
}
try {
  const { token, secret } = await createApiToken(db, { userId: user.id, name: values.name, role: values.role as Role | undefined }, null);
  console.log(`Token "${token.name}" for ${user.email} (role ${token.role}). Store it now; it is not shown again:`);
  console.log(secret);
} catch (err) {
  console.error((err as Error).message);
  process.exit(2);
} finally {
  client.close();
}
