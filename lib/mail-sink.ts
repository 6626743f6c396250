import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { desc } from "drizzle-orm";
import type { Db } from "@/db/client";
import { sinkMessages } from "@/db/schema/mail";

/**
 * The local SMTP sink: accepts every message on loopback and stores it in the database, so the
 * app's development page and the tests can read what Ovenward sent. No real provider is needed.
 */
export function startMailSink({ db, port, host = "127.0.0.1" }: { db: Db; port: number; host?: string }): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address).join(", ");
          const headers: Record<string, string> = {};
          for (const [k, v] of mail.headers) headers[k] = typeof v === "string" ? v : JSON.stringify(v);
          await db.insert(sinkMessages).values({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: to,
            subject: mail.subject ?? null,
            text: mail.text ?? null,
            html: typeof mail.html === "string" ? mail.html : null,
            headers,
          });
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => resolve(server));
  });
}

export async function latestSinkMessages(db: Db, limit = 100) {
  return db.select().from(sinkMessages).orderBy(desc(sinkMessages.id)).limit(limit);
}
