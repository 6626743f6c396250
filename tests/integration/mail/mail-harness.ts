import nodemailer from "nodemailer";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { outbox, sinkMessages, subscriptions, type MailKind } from "@/db/schema/mail";
import { users } from "@/db/schema/users";
import { startMailSink } from "@/lib/mail-sink";
import { runTick } from "@/lib/jobs/tick";
import { createTestDb } from "../test-db";

/** A seeded test database, the real SMTP sink on its own port, and a transport pointed at it. */
export async function mailHarness(port: number) {
  const t = await createTestDb();
  // Start from a clean slate: only the subscriptions each test makes.
  await t.db.delete(subscriptions);
  let sink = await startMailSink({ db: t.db, port });
  const transport = nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true, connectionTimeout: 2000 });
  return {
    db: t.db,
    transport,
    tick: (now: Date, holder?: string) => runTick({ db: t.db, now, transport, from: "Ovenward <ovenward@brightwater.example>", holder }),
    stopSink: () => new Promise<void>((r) => sink.close(() => r())),
    startSink: async () => {
      sink = await startMailSink({ db: t.db, port });
    },
    received: () => t.db.select().from(sinkMessages).orderBy(sinkMessages.id),
    outboxRows: () => t.db.select().from(outbox).orderBy(outbox.id),
    close: async () => {
      transport.close();
      await new Promise<void>((r) => sink.close(() => r()));
      t.close();
    },
  };
}

export async function userId(db: Db, email: string) {
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return u.id;
}

export async function subscribe(db: Db, email: string, kind: MailKind, opts: { schedule?: string; sendAt?: string; createdAt: Date }) {
  const [row] = await db
    .insert(subscriptions)
    .values({ userId: await userId(db, email), kind, enabled: true, schedule: opts.schedule ?? null, sendAt: opts.sendAt ?? null, createdAt: opts.createdAt, updatedAt: opts.createdAt })
    .returning();
  return row;
}

export const at = (iso: string) => new Date(iso);
