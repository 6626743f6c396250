// A standalone SMTP sink for development (`npm run smtp-sink`), storing messages in DATABASE_URL.
import { openDatabase } from "../db/client";
import { migrateDatabase } from "../db/migrate";
import { startMailSink } from "../lib/mail-sink";
import { env } from "../lib/env";

const { db } = await openDatabase(env().DATABASE_URL, env().DATABASE_AUTH_TOKEN);
await migrateDatabase(db);
await startMailSink({ db, port: env().SMTP_SINK_PORT });
console.log(`SMTP sink listening on 127.0.0.1:${env().SMTP_SINK_PORT}; messages go to ${env().DATABASE_URL}`);
